import type { Role, UserView } from '@stormhour/shared';

export interface PeopleFilter {
  /** Matched against e-mail and name, ignoring case. */
  query: string;
  role: Role | null;
}

export function filterPeople(users: readonly UserView[], filter: PeopleFilter): UserView[] {
  const needle = filter.query.trim().toLocaleLowerCase();
  return users.filter(
    (user) =>
      (filter.role === null || user.role === filter.role) &&
      (needle === '' ||
        user.email.toLocaleLowerCase().includes(needle) ||
        user.name.toLocaleLowerCase().includes(needle)),
  );
}

/** Form fields are strings; the API wants a district id only for officers, as a number. */
export function districtIdFor(role: string, districtField: string): number | null {
  if (role !== 'officer' || districtField === '') return null;
  const id = Number(districtField);
  return Number.isInteger(id) && id > 0 ? id : null;
}
