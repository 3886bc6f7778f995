/**
 * The e-mailed links a person opens: an invitation to a farm and a lender share. Each is read by
 * its token (what it offers, and whether the address has an account), then accepted, which
 * signs the person in (signing up first when they have no account) and says where to go.
 */
import { defineStore } from 'pinia';
import { readonly, ref, shallowRef } from 'vue';
import type { AcceptInvitationInput } from '@shared/schema/accounts';
import type { Session } from '@shared/responses';
import { messageFor } from '@/api/messages';
import { invitationsApi, type InvitationPreview } from '@/api/members';
import { lenderApi, type SharePreview } from '@/api/lender';
import { useSessionStore } from './session';

interface LinkApi<Preview, Accepted extends Session> {
  preview: (token: string) => Promise<Preview>;
  accept: (token: string, input: AcceptInvitationInput) => Promise<Accepted>;
}

/** A store for one kind of link; `unreadable` is said when the link cannot be read and the server gave no reason. */
function defineLinkStore<Preview, Accepted extends Session>(id: string, api: LinkApi<Preview, Accepted>, unreadable: string) {
  return defineStore(id, () => {
    const token = ref('');
    const preview = shallowRef<Preview | null>(null);
    const loadError = ref<string | null>(null);

    async function open(next: string): Promise<void> {
      token.value = next;
      preview.value = null;
      loadError.value = null;
      try {
        const answer = await api.preview(next);
        if (token.value === next) preview.value = answer;
      } catch (error) {
        if (token.value === next) loadError.value = messageFor(error, unreadable);
      }
    }

    /** Accepts the open link; the answer's session becomes the signed-in one. Errors are the form's to show. */
    async function accept(input: AcceptInvitationInput): Promise<Accepted> {
      const accepted = await api.accept(token.value, input);
      useSessionStore().adopt({ user: accepted.user, memberships: accepted.memberships });
      return accepted;
    }

    return { preview, loadError: readonly(loadError), open, accept };
  });
}

export const useInvitationLinkStore = defineLinkStore<InvitationPreview, Awaited<ReturnType<typeof invitationsApi.accept>>>(
  'invitation-link',
  invitationsApi,
  'Could not open the invitation. Please try again.',
);

export const useShareLinkStore = defineLinkStore<SharePreview, Awaited<ReturnType<typeof lenderApi.accept>>>(
  'share-link',
  lenderApi,
  'Could not open the link. Please try again.',
);
