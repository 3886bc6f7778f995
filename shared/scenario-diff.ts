/**
 * What changed between two versions of a scenario document, field by field, with the values
 * also shown in the farm's display units where the field's kind of quantity is known. Pure:
 * the server's compare route and any client view can use it.
 */
import { toDisplay, unitLabel, type Quantity, type UnitSystem } from './units';

/** A JSON value as stored in a scenario document. */
export type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

/** One changed field. `path` is dot notation as in validation errors (`options.1.capitalLines.0.unitCost`). */
export interface FieldChange {
  /** Dot path, with array indices as in the newer document (the older one for a removed item). */
  path: string;
  /** 'changed' for a value, 'added'/'removed' for an id-keyed item or an object key, 'reordered' for an id-keyed list. */
  kind: 'changed' | 'added' | 'removed' | 'reordered';
  from: Json | undefined;
  to: Json | undefined;
  /** The two values in display units, when both are numbers of a known quantity kind; otherwise null (show raw). */
  display: { unit: string; from: number | null; to: number | null } | null;
}

function isObject(value: Json | undefined): value is { [key: string]: Json } {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function hasIds(list: Json[]): list is ({ id: string } & { [key: string]: Json })[] {
  const ids = new Set<string>();
  for (const item of list) {
    if (!isObject(item) || typeof item.id !== 'string' || ids.has(item.id)) return false;
    ids.add(item.id);
  }
  return true;
}

function sameJson(a: Json | undefined, b: Json | undefined): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/** A quantity kind with a factor from the stored unit to the kind's internal unit (stall dimensions are stored in m, shown in in). */
interface FieldKind {
  quantity: Quantity;
  siScale: number;
}

const kind = (quantity: Quantity, siScale = 1): FieldKind => ({ quantity, siScale });

/** Field name (last path segment) → quantity kind; the names are unique enough across the document. */
const FIELD_KINDS: Readonly<Record<string, FieldKind>> = {
  yieldKgPerCowDay: kind('yield'),
  systemYieldAdjustment: kind('yield'),
  milkPricePerKg: kind('milkPrice'),
  marginalFeedCostPerKgMilk: kind('pricePerKg'),
  milkQualityPricePerKg: kind('pricePerKg'),
  nitrogenPerKg: kind('pricePerKg'),
  phosphatePerKg: kind('pricePerKg'),
  potashPerKg: kind('pricePerKg'),
  massKgPerCowDay: kind('massPerDay'),
  nitrogenKgPerCowDay: kind('massPerDay'),
  phosphorusKgPerCowDay: kind('massPerDay'),
  potassiumKgPerCowDay: kind('massPerDay'),
  kgPerStallDay: kind('massPerDay'),
  pricePerTonne: kind('pricePerTonne'),
  troughPerimeterM: kind('length'),
  fillRateLitresPerMinute: kind('flowRate'),
  handlingCostPerM3: kind('pricePerVolume'),
  sandExtraHandlingCostPerM3: kind('pricePerVolume'),
  washWaterM3PerCowDay: kind('storageVolume'),
  openStorageAreaM2: kind('area'),
  netRainMPerYear: kind('shortLength', 100),
  freeboardM: kind('length'),
  widthM: kind('shortLength', 100),
  lengthM: kind('shortLength', 100),
  neckRailHeightM: kind('shortLength', 100),
  neckRailFromCurbM: kind('shortLength', 100),
  brisketLocatorFromCurbM: kind('shortLength', 100),
  brisketLocatorHeightM: kind('shortLength', 100),
};

/** A capital line's quantity and unit cost take their kind from the line's unit. */
function capitalLineKind(field: string, unit: Json | undefined): FieldKind | null {
  if (unit === 'per-m2') return field === 'quantity' ? kind('area') : field === 'unitCost' ? kind('pricePerArea') : null;
  if (unit === 'per-m3') return field === 'quantity' ? kind('volume') : field === 'unitCost' ? kind('pricePerVolume') : null;
  return null;
}

/** The quantity kind of the field at `path` (segments) in `document`, or null when it has none. */
export function fieldKind(path: readonly (string | number)[], document: Json): FieldKind | null {
  const field = path[path.length - 1];
  if (typeof field !== 'string') return null;
  if (path[path.length - 3] === 'capitalLines') {
    let parent: Json | undefined = document;
    for (const segment of path.slice(0, -1)) {
      parent = Array.isArray(parent) ? parent[Number(segment)] : isObject(parent) ? parent[String(segment)] : undefined;
    }
    if (isObject(parent)) return capitalLineKind(field, parent.unit);
  }
  return FIELD_KINDS[field] ?? null;
}

function displayOf(
  path: (string | number)[],
  from: Json | undefined,
  to: Json | undefined,
  toDoc: Json,
  units: UnitSystem,
): FieldChange['display'] {
  // `path` holds the newer document's indices, so the kind is read there.
  const fieldKindNow = fieldKind(path, toDoc);
  if (!fieldKindNow) return null;
  const number = (value: Json | undefined): number | null =>
    typeof value === 'number' ? toDisplay(value * fieldKindNow.siScale, fieldKindNow.quantity, units) : null;
  if (number(from) === null && number(to) === null) return null;
  return { unit: unitLabel(fieldKindNow.quantity, units), from: number(from), to: number(to) };
}

/**
 * Lists the changed fields from `from` to `to` (two scenario documents, SI values). Objects are
 * compared key by key; lists of items with unique `id`s (options, lines) are matched by id, so a
 * reorder is one 'reordered' change and not a change in every item; other lists are compared whole.
 */
export function diffScenarios(from: Json, to: Json, units: UnitSystem): FieldChange[] {
  const changes: FieldChange[] = [];
  const push = (path: (string | number)[], changeKind: FieldChange['kind'], a: Json | undefined, b: Json | undefined) => {
    changes.push({
      path: path.join('.'),
      kind: changeKind,
      from: a,
      to: b,
      display: changeKind === 'changed' ? displayOf(path, a, b, to, units) : null,
    });
  };

  const walk = (a: Json | undefined, b: Json | undefined, pathA: (string | number)[], pathB: (string | number)[]): void => {
    if (sameJson(a, b)) return;
    if (isObject(a) && isObject(b)) {
      for (const key of new Set([...Object.keys(a), ...Object.keys(b)])) {
        if (!(key in b)) push([...pathA, key], 'removed', a[key], undefined);
        else if (!(key in a)) push([...pathB, key], 'added', undefined, b[key]);
        else walk(a[key], b[key], [...pathA, key], [...pathB, key]);
      }
      return;
    }
    if (Array.isArray(a) && Array.isArray(b) && hasIds(a) && hasIds(b)) {
      const indexInA = new Map(a.map((item, index) => [item.id, index]));
      const indexInB = new Map(b.map((item, index) => [item.id, index]));
      a.forEach((item, index) => {
        if (!indexInB.has(item.id)) push([...pathA, index], 'removed', item, undefined);
      });
      b.forEach((item, index) => {
        const old = indexInA.get(item.id);
        if (old === undefined) push([...pathB, index], 'added', undefined, item);
        else walk(a[old], item, [...pathA, old], [...pathB, index]);
      });
      const keptA = a.map((item) => item.id).filter((id) => indexInB.has(id));
      const keptB = b.map((item) => item.id).filter((id) => indexInA.has(id));
      if (!sameJson(keptA, keptB)) push(pathB, 'reordered', keptA, keptB);
      return;
    }
    push(pathB, 'changed', a, b);
  };

  walk(from, to, [], []);
  return changes;
}
