import { describe, expect, it } from 'vitest';
import { fieldErrorsFromZod } from './fieldErrors';
import { landingPathFor } from './landing';
import { withQuery } from './queryString';

describe('landingPathFor', () => {
  // The first section of each role in SECTIONS order (shared/roles.ts).
  it.each([
    ['admin', '/bulletins'],
    ['scientist', '/atlas'],
    ['writer', '/outlook'],
    ['officer', '/inbox'],
  ] as const)('%s → %s', (role, path) => {
    expect(landingPathFor(role)).toBe(path);
  });
});

describe('withQuery', () => {
  it.each([
    [{}, '/api/blocks'],
    [{ q: '', districtId: undefined, role: null }, '/api/blocks'],
    [{ districtId: 3, q: 'sal low' }, '/api/blocks?districtId=3&q=sal+low'],
  ])('%o → %s', (params, url) => {
    expect(withQuery('/api/blocks', params)).toBe(url);
  });
});

describe('fieldErrorsFromZod', () => {
  it('names nested fields by their dotted path and keeps the first message', () => {
    expect(
      fieldErrorsFromZod({
        issues: [
          { path: ['email'], message: 'first' },
          { path: ['email'], message: 'second' },
          { path: ['address', 'city'], message: 'city' },
        ],
      }),
    ).toEqual({ email: 'first', 'address.city': 'city' });
  });
});
