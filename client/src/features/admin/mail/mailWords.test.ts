import { describe, expect, it } from 'vitest';
import { formatBytes, outboxStateTagType, outboxStateText, recipientsText } from './mailWords';

describe('mail log words', () => {
  // SI prefixes: kilo = 1000 (BIPM SI Brochure, 9th ed., Table 7).
  it.each([
    [0, '0 B'],
    [999, '999 B'],
    [1000, '1.0 kB'],
    [14_200, '14.2 kB'],
    [3_100_000, '3.1 MB'],
  ])('%i bytes read as %s', (bytes, text) => {
    expect(formatBytes(bytes)).toBe(text);
  });

  it('tells a first wait from a retry', () => {
    expect(outboxStateText('queued', 0)).toBe('Queued');
    expect(outboxStateText('queued', 2)).toBe('Waiting to retry');
    expect(outboxStateText('failed', 8)).toBe('Failed');
    expect(outboxStateTagType(outboxStateText('queued', 2))).toBe('warm-gray');
    expect(outboxStateTagType(outboxStateText('failed', 8))).toBe('red');
    expect(outboxStateTagType(outboxStateText('sent', 1))).toBe('green');
  });

  it('shortens a long recipient list', () => {
    expect(recipientsText(['a@x.example'])).toBe('a@x.example');
    expect(recipientsText(['a@x.example', 'b@x.example', 'c@x.example', 'd@x.example'])).toBe(
      'a@x.example, b@x.example and 2 more',
    );
  });
});
