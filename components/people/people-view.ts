import {
  organizationKindLabels,
  roleLabels,
  roles,
  rolesOfOrganizationKind,
  type OrganizationKind,
  type OrganizationSummary,
  type PersonSummary,
  type Role,
} from '@/db/contracts';

/**
 * What the people screen shows, as plain functions so they can be tested as tables: the find box, the
 * order of the list, and which roles to offer where. Who may change whom is not here: each person's
 * `allowed` list comes from the server.
 */

export type PeopleShow = 'all' | 'active' | 'inactive';

/** Every word typed must be found in the name, address, organisation or role, in any order. */
export function matchesPerson(p: PersonSummary, text: string): boolean {
  const words = text.toLowerCase().split(/\s+/).filter(Boolean);
  if (!words.length) return true;
  const hay = [
    p.name,
    p.email,
    p.organizationName ?? '',
    roleLabels[p.role],
    p.lead ? 'lead engineer' : '',
    p.active ? '' : 'deactivated',
  ]
    .join(' ')
    .toLowerCase();
  return words.every((w) => hay.includes(w));
}

/** Active people first, each group by name: the people one works with before those who left. */
export function sortPeople(list: readonly PersonSummary[]): PersonSummary[] {
  return [...list].sort(
    (a, b) => Number(b.active) - Number(a.active) || a.name.localeCompare(b.name) || a.email.localeCompare(b.email),
  );
}

export function filterPeople(list: readonly PersonSummary[], text: string, show: PeopleShow): PersonSummary[] {
  return sortPeople(list.filter((p) => (show === 'all' || (show === 'active') === p.active) && matchesPerson(p, text)));
}

/** "12 people · 2 deactivated", or "3 of 12 shown" once the list is narrowed. */
export function peopleCount(all: readonly PersonSummary[], shown: number): string {
  const inactive = all.filter((p) => !p.active).length;
  const total = `${all.length} ${all.length === 1 ? 'person' : 'people'}`;
  if (shown !== all.length) return `${shown} of ${total} shown`;
  return inactive ? `${total} · ${inactive} deactivated` : total;
}

/**
 * The roles a person of an organisation of this kind can hold (the contract's table); any role when
 * there is no organisation or its kind is not known here, and the server has the last word.
 */
export function rolesFor(kind: OrganizationKind | null | undefined): readonly Role[] {
  return kind ? rolesOfOrganizationKind[kind] : roles;
}

/** The organisations an invitation for this role can name: those whose kind holds the role. */
export function organizationsFor(role: Role | undefined, orgs: readonly OrganizationSummary[]): OrganizationSummary[] {
  if (!role) return [...orgs];
  return orgs
    .filter((o) => rolesOfOrganizationKind[o.kind].includes(role))
    .sort((a, b) => a.name.localeCompare(b.name));
}

export function organizationWords(o: Pick<OrganizationSummary, 'kind' | 'people'>): string {
  return `${organizationKindLabels[o.kind]} · ${o.people} ${o.people === 1 ? 'person' : 'people'}`;
}

/** The role as a person reads it, with the lead engineer named. */
export function roleWords(p: Pick<PersonSummary, 'role' | 'lead'>): string {
  return p.role === 'supplier' && p.lead ? `${roleLabels.supplier}, lead engineer` : roleLabels[p.role];
}
