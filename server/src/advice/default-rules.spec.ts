import { AdviceRuleRequest } from '@stormhour/shared';
import { describe, expect, it } from 'vitest';
import { DEFAULT_ADVICE_RULES } from './default-rules.js';

describe('the shipped advice rules', () => {
  it.each(DEFAULT_ADVICE_RULES.map((r) => [r.text.slice(0, 40), r] as const))(
    '"%s…" passes the same checks as a rule a scientist saves',
    (_name, rule) => {
      expect(AdviceRuleRequest.safeParse(rule).error?.issues ?? []).toEqual([]);
      expect(rule.source.length).toBeGreaterThan(0);
    },
  );

  it('defers spraying and fertilising to the label and licensed advice, and storms to official warnings', () => {
    for (const rule of DEFAULT_ADVICE_RULES) {
      if (/spray|top-dress|fertilis/i.test(rule.text))
        expect(rule.text).toMatch(/label and licensed local advice/);
      if (/lightning|heavy showers/i.test(rule.text)) expect(rule.text).toMatch(/Official warnings/);
    }
  });

  it('gives the lightning rule first place and the 30-minute wait (REFERENCES §14: Holle et al. 1999)', () => {
    const lightning = DEFAULT_ADVICE_RULES.find((r) => r.text.startsWith('Lightning'));
    expect(lightning?.priority).toBe(1);
    expect(lightning?.text).toMatch(/building or a closed vehicle/);
    expect(lightning?.text).toMatch(/wait 30 minutes after the last thunder/);
    expect(lightning?.source).toMatch(/Holle/);
  });
});
