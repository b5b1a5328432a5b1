import { z } from 'zod';
import { EmailSchema, IdSchema, PasswordSchema, textSchema } from './common';

import { roles } from './labels';

export { roleLabels, roles, roleWords } from './labels';
export const RoleSchema = z.enum(roles);
export type Role = z.infer<typeof RoleSchema>;

export const SignInBodySchema = z.strictObject({
  email: EmailSchema,
  password: z.string().min(1, 'Enter your password').max(200),
});
export type SignInBody = z.infer<typeof SignInBodySchema>;

export const ClubMembershipSchema = z.object({
  clubId: z.number().int(),
  clubName: z.string(),
  clubSlug: z.string(),
  roles: z.array(RoleSchema),
});
export type ClubMembership = z.infer<typeof ClubMembershipSchema>;

export const SessionUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  clubs: z.array(ClubMembershipSchema),
  /** Where "/" takes them: the club they last opened, else the one where they have the most to do. */
  startClubId: z.number().int().nullable(),
});
export type SessionUser = z.infer<typeof SessionUserSchema>;

/** GET /api/session: who is signed in (user null when nobody) and the CSRF token. */
export const SessionInfoSchema = z.object({
  user: SessionUserSchema.nullable(),
  csrfToken: z.string(),
});
export type SessionInfo = z.infer<typeof SessionInfoSchema>;

/** PUT /api/session/club: the club the person is working in now. */
export const CurrentClubBodySchema = z.strictObject({ clubId: IdSchema });
export type CurrentClubBody = z.infer<typeof CurrentClubBodySchema>;

export const PasswordResetRequestBodySchema = z.strictObject({ email: EmailSchema });
export type PasswordResetRequestBody = z.infer<typeof PasswordResetRequestBodySchema>;

export const PasswordResetBodySchema = z.strictObject({
  token: z.string().min(20).max(200),
  password: PasswordSchema,
});
export type PasswordResetBody = z.infer<typeof PasswordResetBodySchema>;

/** `GET /api/password-resets/check?token=…`: whether a link still works, without using it up. */
export const PasswordResetCheckQuerySchema = PasswordResetBodySchema.pick({ token: true });
/** A working link, and whether it sets the account's first password (none yet) or replaces one. */
export const PasswordResetCheckSchema = z.object({ firstPassword: z.boolean() });
export type PasswordResetCheck = z.infer<typeof PasswordResetCheckSchema>;

export const InviteCreateBodySchema = z.strictObject({
  email: EmailSchema,
  name: textSchema({ min: 1, minMessage: 'Enter a name', max: 120 }),
  roles: z
    .array(RoleSchema)
    .min(1, 'Choose at least one role')
    .max(roles.length, `Choose at most ${roles.length} roles`)
    .refine((list) => new Set(list).size === list.length, 'Choose each role once'),
});
export type InviteCreateBody = z.infer<typeof InviteCreateBodySchema>;

export const InviteSchema = z.object({
  id: z.number().int(),
  clubId: z.number().int(),
  email: z.string(),
  name: z.string(),
  roles: z.array(RoleSchema),
  expiresAt: z.string(),
  acceptedAt: z.string().nullable(),
  createdAt: z.string(),
});
export type Invite = z.infer<typeof InviteSchema>;

/** What the accept-invite page shows before the person sets a password. */
export const InvitePreviewSchema = z.object({
  email: z.string(),
  name: z.string(),
  clubName: z.string(),
  roles: z.array(RoleSchema),
  hasAccount: z.boolean(),
});
export type InvitePreview = z.infer<typeof InvitePreviewSchema>;

export const InviteAcceptBodySchema = z.strictObject({
  token: z.string().min(20).max(200),
  name: textSchema({ min: 1, minMessage: 'Enter your name', max: 120 }),
  password: PasswordSchema,
});
export type InviteAcceptBody = z.infer<typeof InviteAcceptBodySchema>;

export const MemberSchema = z.object({
  userId: z.number().int(),
  name: z.string(),
  email: z.string(),
  roles: z.array(RoleSchema),
  /** Pays the club's concession rate on plot fees. */
  concession: z.boolean(),
  joinedAt: z.string(),
});
export type Member = z.infer<typeof MemberSchema>;

/** A coordinator's change to a member: the whole set of roles, and or the concession. */
export const MemberUpdateBodySchema = z
  .strictObject({
    roles: z
      .array(RoleSchema)
      .min(1, 'Keep at least one role, or remove the member from the club')
      .max(roles.length, `Choose at most ${roles.length} roles`)
      .refine((list) => new Set(list).size === list.length, 'Choose each role once')
      .optional(),
    concession: z.boolean({ message: 'true or false' }).optional(),
  })
  .refine((body) => body.roles !== undefined || body.concession !== undefined, {
    message: 'Send roles, concession or both',
    path: ['roles'],
  });
export type MemberUpdateBody = z.infer<typeof MemberUpdateBodySchema>;
