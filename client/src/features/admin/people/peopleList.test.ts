import { describe, expect, it } from 'vitest';
import { aUser } from '../../../test/builders';
import { districtIdFor, filterPeople } from './peopleList';

const people = [
  aUser({ id: 1, email: 'ila.admin@vessary.example', name: 'Ila Marren', role: 'admin' }),
  aUser({ id: 2, email: 'tovan.reed@vessary.example', name: 'Tovan Reed', role: 'writer' }),
  aUser({ id: 3, email: 'mira.tollan@vessary.example', name: 'Mira Tollan', role: 'officer', districtId: 2 }),
];

describe('filterPeople', () => {
  it.each([
    ['everyone', '', null, [1, 2, 3]],
    ['by name, any case', 'REED', null, [2]],
    ['by e-mail', 'tollan@', null, [3]],
    ['by role', '', 'admin', [1]],
    ['by both', 'reed', 'officer', []],
  ] as const)('%s', (_name, query, role, ids) => {
    expect(filterPeople(people, { query, role }).map((u) => u.id)).toEqual(ids);
  });
});

describe('districtIdFor', () => {
  it.each([
    ['officer', '3', 3],
    ['officer', '', null],
    ['officer', 'x', null],
    ['writer', '3', null],
  ])('%s with "%s" → %s', (role, field, id) => {
    expect(districtIdFor(role, field)).toBe(id);
  });
});
