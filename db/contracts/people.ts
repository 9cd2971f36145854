import { z } from 'zod';
import { emailAddress, plainText, roles, type Role } from './common';

/**
 * Organisations, people and their places on a build, and who may manage whom. The one home of these
 * rules: the server enforces them, the screens read `allowed` lists from the answers.
 */

export const organizationKinds = ['supplier', 'shop', 'inspection'] as const;
export type OrganizationKind = (typeof organizationKinds)[number];
export const organizationKindLabels: Record<OrganizationKind, string> = {
  supplier: 'Kit supplier',
  shop: 'Build shop',
  inspection: 'Inspection body',
};

/** A person's place on one build; each place belongs to one account role. */
export const memberPlaces = ['owner', 'helper', 'adviser', 'final_inspector'] as const;
export type MemberPlace = (typeof memberPlaces)[number];
export const memberPlaceLabels: Record<MemberPlace, string> = {
  owner: 'Owner and builder',
  helper: 'Helper',
  adviser: 'Technical adviser',
  final_inspector: 'Final inspector',
};
/** The account roles that take a place on a build (build_members.role). */
export const buildMemberRoles = ['builder', 'inspector'] as const;
type BuildMemberRole = (typeof buildMemberRoles)[number];
export const memberRoleOfPlace: Record<MemberPlace, BuildMemberRole> = {
  owner: 'builder',
  helper: 'builder',
  adviser: 'inspector',
  final_inspector: 'inspector',
};

/** Which account roles an organisation of each kind holds. */
export const rolesOfOrganizationKind: Record<OrganizationKind, readonly Role[]> = {
  supplier: ['supplier'],
  shop: ['builder', 'inspector'],
  inspection: ['inspector'],
};

/** One-time links: an invitation lasts a week, a password reset an hour (common practice). */
export const INVITATION_TTL_HOURS = 7 * 24;
export const RESET_TTL_MINUTES = 60;
/** The least password strength accepted, on the strength package's 0–4 scale. */
export const MIN_PASSWORD_SCORE = 3;

const email = emailAddress();
const personName = plainText('the name', 1, 120, 'give the person’s name');
/** Strength is judged by the server with the strength package; here only the bounds. */
const newPassword = z
  .string({ message: 'enter a password' })
  .min(10, 'use at least 10 characters')
  .max(200, 'keep the password under 200 characters');
const oneTimeToken = z
  .string({ message: 'the link is incomplete' })
  .regex(/^[A-Za-z0-9_-]{20,100}$/, 'the link is incomplete or damaged: open it again from the mail');

export const organizationInput = z.object({
  name: plainText('the name', 2, 120, 'give the organisation’s name'),
  kind: z.enum(organizationKinds, { message: 'choose kit supplier, build shop or inspection body' }),
});
export type OrganizationInput = z.input<typeof organizationInput>;

export const inviteInput = z.object({
  email,
  name: personName,
  role: z.enum(roles, { message: 'choose a role' }),
  organizationId: z.uuid({ message: 'choose an organisation' }).nullable().default(null),
  /** A supplier's engineer who may manage their own organisation's engineers. */
  lead: z.boolean().default(false),
});
export type InviteInput = z.input<typeof inviteInput>;

export const personUpdateInput = z
  .object({
    role: z.enum(roles, { message: 'choose a role' }).optional(),
    active: z.boolean().optional(),
    lead: z.boolean().optional(),
  })
  .refine((v) => v.role !== undefined || v.active !== undefined || v.lead !== undefined, 'say what to change');
export type PersonUpdateInput = z.input<typeof personUpdateInput>;

export const acceptInvitationInput = z.object({ token: oneTimeToken, name: personName, password: newPassword });
export type AcceptInvitationInput = z.input<typeof acceptInvitationInput>;

export const forgotPasswordInput = z.object({ email });
export const resetPasswordInput = z.object({ token: oneTimeToken, password: newPassword });
export type ResetPasswordInput = z.input<typeof resetPasswordInput>;
export const changePasswordInput = z.object({
  currentPassword: z.string().min(1, 'enter your current password').max(200),
  newPassword,
});
export type ChangePasswordInput = z.input<typeof changePasswordInput>;

export const addMemberInput = z.object({
  email,
  place: z.enum(memberPlaces, { message: 'choose the person’s place on the build' }),
  /** Used for the invitation when the address has no account yet. */
  name: personName.optional(),
});
export type AddMemberInput = z.input<typeof addMemberInput>;

export const handOverInput = z.object({ userId: z.uuid({ message: 'choose the new owner' }) });

export type OrganizationSummary = {
  id: string;
  name: string;
  kind: OrganizationKind;
  people: number;
  createdAt: string;
};
export type PersonSummary = {
  id: string;
  email: string;
  name: string;
  role: Role;
  organizationId: string | null;
  organizationName: string | null;
  active: boolean;
  lead: boolean;
  createdAt: string;
  /** What the reader may change on this person. */
  allowed: PersonAction[];
};
/** An invitation as the person invited sees it. */
export type InvitationView = {
  email: string;
  name: string;
  role: Role;
  organizationName: string | null;
  invitedByName: string;
  expiresAt: string;
};
/** An invitation in the list of those not yet taken up: with its id, and the build and place it offers. */
export type PendingInvitation = InvitationView & {
  id: string;
  buildKitSerial: string | null;
  place: MemberPlace | null;
};

export type BuildMember = { userId: string; name: string; email: string; place: MemberPlace; addedAt: string };
export type BuildPeople = {
  members: BuildMember[];
  /** Invited to the build, no account yet. */
  pending: { email: string; name: string; place: MemberPlace; expiresAt: string }[];
  /** What the reader may do with the build's people. */
  allowed: BuildPeopleAction[];
};

// ---- Who may manage whom ----

/** The reader as the rules see them. */
export type Manager = { id: string; role: Role; organizationId: string | null; lead: boolean };

export const personActions = ['change-role', 'deactivate', 'reactivate', 'make-lead'] as const;
export type PersonAction = (typeof personActions)[number];

/**
 * Whether `who` may invite a person of `role` into `organizationId`. The admin invites anyone; a
 * supplier's lead engineer invites engineers into their own organisation.
 */
export function mayInvite(who: Manager, role: Role, organizationId: string | null): string | null {
  if (who.role === 'admin') return null;
  if (who.role === 'supplier' && who.lead) {
    return role === 'supplier' && organizationId === who.organizationId
      ? null
      : 'a lead engineer invites engineers of their own organisation only';
  }
  return 'only an admin or a supplier’s lead engineer manages people';
}

/** What `who` may change on `person`: nobody changes themselves here (their own account page does that). */
export function allowedPersonActions(
  who: Manager,
  person: { id: string; role: Role; organizationId: string | null; active: boolean; lead: boolean },
): PersonAction[] {
  if (who.id === person.id) return [];
  const manages =
    who.role === 'admin' ||
    (who.role === 'supplier' && who.lead && person.role === 'supplier' && person.organizationId === who.organizationId);
  if (!manages) return [];
  const out: PersonAction[] = [];
  if (who.role === 'admin') out.push('change-role');
  out.push(person.active ? 'deactivate' : 'reactivate');
  if (person.role === 'supplier' && !person.lead) out.push('make-lead');
  return out;
}

export const buildPeopleActions = ['add', 'remove', 'hand-over'] as const;
export type BuildPeopleAction = (typeof buildPeopleActions)[number];

/** The supplier who shipped the build (its engineers) and the build's owner manage its people. */
export function allowedBuildPeopleActions(
  who: { role: Role; organizationId: string | null },
  build: { organizationId: string },
  readerPlace: MemberPlace | null,
): BuildPeopleAction[] {
  const supplier = who.role === 'supplier' && who.organizationId === build.organizationId;
  if (supplier || readerPlace === 'owner') return ['add', 'remove', 'hand-over'];
  return [];
}

/** Why a member cannot be removed, or null: a build always keeps its owner (hand it over first). */
export function removalRefusal(member: { place: MemberPlace }): string | null {
  return member.place === 'owner' ? 'the owner cannot be removed: hand the build to another builder first' : null;
}

/** Places a build has at most one of. */
export const singlePlaces: readonly MemberPlace[] = ['owner'];
