/** Document uploads and quotes: request fields shared by the client and the API, and what the API answers. */
import { z } from 'zod';

/** Largest single upload (bytes): 15 MB. */
export const MAX_DOCUMENT_BYTES = 15 * 1024 * 1024;

/** What an upload may be, by the type sniffed from its bytes. */
export const documentTypes = {
  'application/pdf': { label: 'PDF', extensions: ['pdf'] },
  'image/png': { label: 'PNG', extensions: ['png'] },
  'image/jpeg': { label: 'JPEG', extensions: ['jpg', 'jpeg'] },
  'image/webp': { label: 'WebP', extensions: ['webp'] },
  'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet': { label: 'XLSX', extensions: ['xlsx'] },
  'text/csv': { label: 'CSV', extensions: ['csv'] },
} as const satisfies Record<string, { label: string; extensions: readonly string[] }>;
export type DocumentMediaType = keyof typeof documentTypes;

const scenarioId = z.coerce
  .number({ error: 'Scenario must be a scenario id' })
  .int('Scenario must be a scenario id')
  .positive('Scenario must be a scenario id');
const capitalLineId = z
  .string({ error: 'Capital line must be a capital line id' })
  .trim()
  .min(1, 'Capital line must not be empty')
  .max(60, 'Capital line id must be at most 60 characters');

/** The text fields sent with an upload: where the document is attached. */
export const documentTargetSchema = z
  .object({ scenarioId: scenarioId.optional(), capitalLineId: capitalLineId.optional() })
  .refine((v) => v.capitalLineId === undefined || v.scenarioId !== undefined, {
    path: ['capitalLineId'],
    message: 'A capital line needs its scenario (scenarioId)',
  });
export type DocumentTarget = z.infer<typeof documentTargetSchema>;

/** Query of the documents list: all of the farm's, or those of one scenario or capital line. */
export const documentListQuerySchema = documentTargetSchema;

/** PATCH body: the quote's amount in the farm's currency, or null to clear it. */
export const documentPatchSchema = z.object({
  quoteAmount: z
    .number({ error: 'Quote amount must be a number' })
    .min(0, 'Quote amount must not be negative')
    .max(1e11, 'Quote amount must be at most 100 000 000 000')
    .nullable(),
});

export interface DocumentView {
  id: number;
  fileName: string;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
  scenarioId: number | null;
  capitalLineId: string | null;
  quoteAmount: number | null;
  uploadedBy: { id: number; name: string } | null;
  createdAt: string;
}

/** One capital line of a scenario and the quotes on it: `quoted` when at least one has an amount. */
export interface CapitalLineQuotes {
  capitalLineId: string;
  quoted: boolean;
  /** Sum of the amounts entered on this line's documents (farm currency); null when none. */
  quoteTotal: number | null;
  documents: { id: number; fileName: string; quoteAmount: number | null }[];
}
