import { describe, expect, it } from 'vitest';
import { summariseDetail } from './auditDetail';

describe('summariseDetail', () => {
  it.each([
    [null, ''],
    [{}, ''],
    [{ role: 'writer', active: false }, 'role: writer; active: false'],
    [{ blocks: [1, 2, 3], districtId: 2, note: null }, 'blocks: 3 items; districtId: 2; note: —'],
    [{ from: { role: 'writer' } }, 'from: {…}'],
  ])('%o → "%s"', (detail, text) => {
    expect(summariseDetail(detail)).toBe(text);
  });

  it('cuts a long summary to the given length with an ellipsis', () => {
    const text = summariseDetail({ message: 'x'.repeat(200) }, 20);
    expect(text).toHaveLength(20);
    expect(text.endsWith('…')).toBe(true);
  });
});
