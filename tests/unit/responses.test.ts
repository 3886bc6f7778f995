/**
 * The API's answers are typed once in shared/responses.ts. These checks run in the type check
 * (`npm run typecheck`): each service returns exactly the shared type the client reads, and every
 * shared type survives JSON unchanged (no Date or other value that JSON turns into something
 * else), so what the server sends is what the client's type says it gets.
 */
import { describe, expectTypeOf, it } from 'vitest';
import type * as R from '@shared/responses';
import type * as scenarios from '../../server/services/scenarios';
import type * as preferences from '../../server/services/preferences';
import type * as reviews from '../../server/services/review-notes';
import type * as shares from '../../server/services/lender-shares';
import type * as audit from '../../server/services/audit';
import type * as baseline from '../../server/services/farm-baseline';
import type * as invitations from '../../server/services/invitations';
import type * as farms from '../../server/services/farms';
import type * as members from '../../server/services/members';
import type * as milkRecords from '../../server/services/milk-records';
import type * as accounts from '../../server/services/accounts';
import type { SentMail } from '../../server/mail/mailer';
import type * as client from '@/api/scenarios';
import type * as membersClient from '@/api/members';
import type * as milkClient from '@/api/milk-records';
import type * as adminClient from '@/api/admin';
import type * as lenderClient from '@/api/lender';

/** What JSON.parse(JSON.stringify(value)) gives back, for the value kinds the API sends. */
type Jsonified<T> = unknown extends T
  ? T
  : T extends Date
  ? string
  : T extends string | number | boolean | null
    ? T
    : T extends readonly (infer E)[]
      ? Jsonified<E>[]
      : T extends object
        ? { [K in keyof T as T[K] extends (...args: never[]) => unknown ? never : K]: Jsonified<T[K]> }
        : never;

type Answer<F extends (...args: never[]) => unknown> = Awaited<ReturnType<F>>;

describe('API response types', () => {
  it('are what the services return', () => {
    expectTypeOf<Answer<typeof scenarios.listFarmScenarios>>().toEqualTypeOf<R.ScenarioListItem[]>();
    expectTypeOf<Answer<typeof scenarios.readScenario>>().toEqualTypeOf<R.JsonText<R.ScenarioView>>();
    expectTypeOf<Answer<typeof scenarios.readResultsDetail>>().toEqualTypeOf<R.JsonText<R.ResultsDetailView>>();
    expectTypeOf<Answer<typeof scenarios.scenarioVersions>>().toEqualTypeOf<R.VersionListItem[]>();
    expectTypeOf<Answer<typeof scenarios.readVersion>>().toEqualTypeOf<R.JsonText<R.VersionView>>();
    expectTypeOf<Answer<typeof scenarios.compareVersions>>().toEqualTypeOf<R.VersionComparison>();
    expectTypeOf<Answer<typeof preferences.readPreferences>>().toEqualTypeOf<R.PreferencesView>();
    expectTypeOf<Answer<typeof preferences.readRiskResult>>().toEqualTypeOf<R.RiskResultView | null>();
    expectTypeOf<Answer<typeof reviews.scenarioReviews>>().toEqualTypeOf<R.ShareReview[]>();
    expectTypeOf<Answer<typeof reviews.addLenderNote>>().toEqualTypeOf<R.ReviewNote>();
    expectTypeOf<Answer<typeof shares.farmShares>>().toEqualTypeOf<R.ShareView[]>();
    expectTypeOf<Answer<typeof audit.readAuditLog>>().toEqualTypeOf<R.AuditPage>();
    expectTypeOf<Answer<typeof baseline.readBaseline>>().toEqualTypeOf<R.FarmBaseline>();
    expectTypeOf<Answer<typeof invitations.previewInvitation>>().toEqualTypeOf<R.InvitationPreview>();
    expectTypeOf<Answer<typeof farms.farmsOf>>().toEqualTypeOf<R.FarmSummary[]>();
    expectTypeOf<Answer<typeof farms.farmDetail>>().toEqualTypeOf<R.FarmDetail>();
    expectTypeOf<Jsonified<Answer<typeof members.farmMembers>>>().toEqualTypeOf<R.FarmMember[]>();
    expectTypeOf<Answer<typeof milkRecords.milkRecordHistory>>().toEqualTypeOf<R.MilkRecordHistory>();
    // The admin route sends these fields of each listed account.
    type Listed = Pick<Answer<typeof accounts.listAccounts>[number], keyof R.AccountListing>;
    expectTypeOf<Jsonified<Listed>>().toEqualTypeOf<R.AccountListing>();
    expectTypeOf<Jsonified<SentMail>>().toEqualTypeOf<R.CapturedMail>();
  });

  it('are what the client reads', () => {
    expectTypeOf<client.ScenarioDocument>().toEqualTypeOf<R.ScenarioView>();
    expectTypeOf<client.VersionDocument>().toEqualTypeOf<R.VersionView>();
    expectTypeOf<Answer<typeof membersClient.membersApi.list>>().toEqualTypeOf<R.FarmMember[]>();
    expectTypeOf<Answer<typeof milkClient.milkRecordsApi.history>>().toEqualTypeOf<R.MilkRecordHistory>();
    expectTypeOf<Answer<typeof adminClient.adminApi.users>>().toEqualTypeOf<R.AccountListing[]>();
    expectTypeOf<Answer<typeof lenderClient.lenderApi.accept>>().toEqualTypeOf<R.AcceptedShare>();
  });

  it('travel through JSON unchanged', () => {
    expectTypeOf<Jsonified<R.ScenarioListItem>>().toEqualTypeOf<R.ScenarioListItem>();
    expectTypeOf<Jsonified<R.ScenarioMeta>>().toEqualTypeOf<R.ScenarioMeta>();
    expectTypeOf<Jsonified<R.VersionListItem>>().toEqualTypeOf<R.VersionListItem>();
    expectTypeOf<Jsonified<R.VersionConflict>>().toEqualTypeOf<R.VersionConflict>();
    expectTypeOf<Jsonified<R.ShareView>>().toEqualTypeOf<R.ShareView>();
    expectTypeOf<Jsonified<R.ReviewThread>>().toEqualTypeOf<R.ReviewThread>();
    expectTypeOf<Jsonified<R.PreferencesView>>().toEqualTypeOf<R.PreferencesView>();
    expectTypeOf<Jsonified<R.AuditEntry>>().toEqualTypeOf<R.AuditEntry>();
    expectTypeOf<Jsonified<R.InvitationPreview>>().toEqualTypeOf<R.InvitationPreview>();
    expectTypeOf<Jsonified<R.FarmSummary>>().toEqualTypeOf<R.FarmSummary>();
    expectTypeOf<Jsonified<R.FarmMember>>().toEqualTypeOf<R.FarmMember>();
    expectTypeOf<Jsonified<R.AccountListing>>().toEqualTypeOf<R.AccountListing>();
    expectTypeOf<Jsonified<R.MilkRecordHistory>>().toEqualTypeOf<R.MilkRecordHistory>();
    expectTypeOf<Jsonified<R.AcceptedShare>>().toEqualTypeOf<R.AcceptedShare>();
  });
});
