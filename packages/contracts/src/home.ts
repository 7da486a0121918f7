// GET /api/home: what the caller's role needs first, computed on the server. Every list is
// already limited to what the caller may read (viewers: published teardowns only).
import { z } from 'zod';
import { safeString } from './common';
import { roleSchema } from './roles';
import { DEVICE_CATEGORY, FINDING_KIND, SEVERITY, TEARDOWN_STATUS } from './domain';

/**
 * A rate table older than this (days since its rate date) is flagged on the sourcing home.
 * [CP] cost reviews commonly refresh reference rates at least monthly.
 */
export const RATES_STALE_AFTER_DAYS = 30;

/** How many rows each home list shows at most. */
export const HOME_LIST_LIMIT = 8;

const person = z.object({ id: z.number().int(), name: safeString() });

export const homeTeardownSchema = z.object({
  id: z.number().int(),
  device: z.object({ id: z.number().int(), maker: safeString(), model: safeString(), category: DEVICE_CATEGORY.schema }),
  unitLabel: safeString().nullable(),
  date: safeString(),
  status: TEARDOWN_STATUS.schema,
  engineer: person,
  updatedAt: safeString(),
  submittedAt: safeString().nullable(),
  publishedAt: safeString().nullable(),
});
export type HomeTeardown = z.infer<typeof homeTeardownSchema>;

export const homeFindingSchema = z.object({
  id: z.number().int(),
  teardownId: z.number().int(),
  device: z.object({ id: z.number().int(), maker: safeString(), model: safeString() }),
  kind: FINDING_KIND.schema,
  severity: SEVERITY.schema,
  text: safeString(),
  createdAt: safeString(),
});
export type HomeFinding = z.infer<typeof homeFindingSchema>;

/** One line of "what needs me": a count and what it is about; `block` names the home block it opens. */
export const NEED_KEYS = ['sent-back', 'drafts', 'reviews', 'unpriced', 'rates', 'invitations'] as const;
export type NeedKey = (typeof NEED_KEYS)[number];
export const homeNeedSchema = z.object({ key: z.enum(NEED_KEYS), count: z.number().int(), label: safeString() });
export type HomeNeed = z.infer<typeof homeNeedSchema>;

export const engineerHomeSchema = z.object({
  /** My drafts that were not sent back (most recently changed first). */
  drafts: z.array(homeTeardownSchema),
  /** My drafts whose last review step was a send-back, with the reviewer's note. */
  sentBack: z.array(homeTeardownSchema.extend({ note: safeString(), by: safeString().nullable(), at: safeString() })),
  /** My teardowns waiting for a lead. */
  inReview: z.array(homeTeardownSchema),
});
export type EngineerHome = z.infer<typeof engineerHomeSchema>;

export const leadHomeSchema = z.object({
  /** Teardowns in review, oldest submission first, with who submitted and when. */
  waiting: z.array(homeTeardownSchema.extend({ submittedBy: person.nullable(), submittedAt: safeString().nullable() })),
  /** Newest findings of major or critical severity across teardowns. */
  severeFindings: z.array(homeFindingSchema),
});
export type LeadHome = z.infer<typeof leadHomeSchema>;

export const ratesAgeSchema = z.object({
  id: z.number().int(),
  base: safeString(),
  date: safeString(),
  source: safeString(),
  /** Whole days from the rate date to today (UTC). */
  ageDays: z.number().int(),
  stale: z.boolean(),
  staleAfterDays: z.number().int(),
});
export type RatesAge = z.infer<typeof ratesAgeSchema>;

export const sourcingHomeSchema = z.object({
  /** Teardowns with at least one part without a price, most unpriced first. */
  unpriced: z.array(homeTeardownSchema.extend({ unpriced: z.number().int(), parts: z.number().int() })),
  /** How many teardowns have unpriced parts (the list may be shorter). */
  unpricedTeardowns: z.number().int(),
  /** The current rate table and its age; null before any table is saved. */
  rates: ratesAgeSchema.nullable(),
});
export type SourcingHome = z.infer<typeof sourcingHomeSchema>;

export const adminHomeSchema = z.object({
  /** Active users by role; deactivated ones are counted apart. */
  usersByRole: z.record(roleSchema, z.number().int()),
  inactiveUsers: z.number().int(),
  recentlyActive: z.array(person.extend({ role: roleSchema, lastSignInAt: safeString() })),
  pendingInvitations: z.array(z.object({ id: z.number().int(), email: safeString(), role: roleSchema, invitedBy: safeString().nullable(), createdAt: safeString(), expiresAt: safeString() })),
  /** The capture server's latest messages; `enabled` false when mail goes out through a real server. */
  outbox: z.object({
    enabled: z.boolean(),
    messages: z.array(z.object({ id: z.number().int(), receivedAt: safeString(), to: safeString(), subject: safeString() })),
  }),
});
export type AdminHome = z.infer<typeof adminHomeSchema>;

export const homeResponse = z.object({
  role: roleSchema,
  /** "What needs me": the lines with a count above zero, and their sum. */
  needs: z.object({ total: z.number().int(), items: z.array(homeNeedSchema) }),
  engineer: engineerHomeSchema.nullable(),
  lead: leadHomeSchema.nullable(),
  sourcing: sourcingHomeSchema.nullable(),
  admin: adminHomeSchema.nullable(),
  recent: z.object({
    /** Newest published teardowns. */
    published: z.array(homeTeardownSchema),
    /** Newest findings in teardowns the caller may read. */
    findings: z.array(homeFindingSchema),
  }),
});
export type HomeResponse = z.infer<typeof homeResponse>;
