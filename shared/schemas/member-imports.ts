import { z } from 'zod';
import { PreferredSizeSchema } from './applications';
import { RoleSchema } from './auth';
import { csvFileSchema } from './common';

/** Columns of a members file, in the order exports and the template use. */
export const memberCsvColumns = ['name', 'email', 'roles', 'send_invite'] as const;
/** Columns of a waiting list file, in the order exports and the template use. */
export const waitlistCsvColumns = [
  'name',
  'email',
  'phone',
  'preferred_size',
  'needs_accessible',
  'needs_raised',
  'preferred_site',
  'applied_on',
  'notes',
] as const;
/** Columns of the allocations export. */
export const allocationCsvColumns = ['year', 'site', 'plot', 'holder_name', 'holder_email', 'status'] as const;

/** The most rows one member or waiting list file may hold. */
export const MAX_MEMBER_IMPORT_ROWS = 2000;

/** A members file (POST /member-imports) or a waitlist file (POST /waitlist-imports). */
export const PeopleImportBodySchema = z.strictObject({
  csv: csvFileSchema(2_000_000, 'The file is larger than 2 MB'),
  /** false: check and preview only; true: check and save all rows or none. */
  commit: z.boolean(),
});
export type PeopleImportBody = z.infer<typeof PeopleImportBodySchema>;

/** One problem in a file: the line (the header is line 1), the column, and what is wrong. */
export const ImportProblemSchema = z.object({ row: z.number().int(), field: z.string(), message: z.string() });
export type ImportProblem = z.infer<typeof ImportProblemSchema>;

/**
 * What an import does with a row. "joins" reads the same whether or not the address already has an
 * account, so the preview tells nobody who uses Tillwell elsewhere.
 */
export const memberImportOutcomes = ['joins', 'member'] as const;
export const memberImportOutcomeLabels: Record<(typeof memberImportOutcomes)[number], string> = {
  joins: 'Joins the club (anyone already on Tillwell gets an invitation to accept instead)',
  member: 'Already a member; new roles only by an invitation they accept',
};

/** A members row as the import reads it. */
export const ImportedMemberSchema = z.object({
  name: z.string(),
  email: z.string(),
  roles: z.array(RoleSchema),
  /**
   * An invitation goes out after the import: asked for, or a member is given new roles. Anyone whose
   * address already has an account is invited too (not shown here, so the preview reveals nothing).
   */
  sendInvite: z.boolean(),
  /** A member of this club who can already sign in (always false for people joining). */
  hasPassword: z.boolean(),
  /** What the import does with them: joins the club, or a member of it already. */
  outcome: z.enum(memberImportOutcomes),
});
export type ImportedMember = z.infer<typeof ImportedMemberSchema>;

/** A waiting list row as the import reads it. */
export const ImportedWaitlistEntrySchema = z.object({
  name: z.string(),
  email: z.string(),
  phone: z.string(),
  preferredSize: PreferredSizeSchema,
  needsAccessible: z.boolean(),
  needsRaised: z.boolean(),
  preferredSiteId: z.number().int().nullable(),
  preferredSiteName: z.string().nullable(),
  /** YYYY-MM-DD; null means "today", after everyone already waiting. */
  appliedOn: z.string().nullable(),
  notes: z.string(),
});
export type ImportedWaitlistEntry = z.infer<typeof ImportedWaitlistEntrySchema>;

export const MembersImportResultSchema = z.object({
  kind: z.literal('members'),
  rows: z.array(z.object({ row: z.number().int(), name: z.string(), email: z.string(), member: ImportedMemberSchema.nullable() })),
  errors: z.array(ImportProblemSchema),
  committed: z.boolean(),
  counts: z.object({
    imported: z.number().int(),
    newAccounts: z.number().int(),
    invitesSent: z.number().int(),
    invitesFailed: z.number().int(),
  }),
});
export type MembersImportResult = z.infer<typeof MembersImportResultSchema>;

export const WaitlistImportResultSchema = z.object({
  kind: z.literal('waitlist'),
  rows: z.array(
    z.object({ row: z.number().int(), name: z.string(), email: z.string(), entry: ImportedWaitlistEntrySchema.nullable() }),
  ),
  errors: z.array(ImportProblemSchema),
  committed: z.boolean(),
  counts: z.object({ imported: z.number().int() }),
});
export type WaitlistImportResult = z.infer<typeof WaitlistImportResultSchema>;

export const MemberImportResultSchema = z.discriminatedUnion('kind', [MembersImportResultSchema, WaitlistImportResultSchema]);
export type MemberImportResult = z.infer<typeof MemberImportResultSchema>;

export const AllocationsExportQuerySchema = z.object({ year: z.coerce.number().int().min(2000).max(2100).optional() });
