import { blue60, teal50 } from '@carbon/colors';
import { describe, expect, it } from 'vitest';
import { coloursForGroups, GROUP_PALETTE } from './groupColours';

describe('coloursForGroups', () => {
  it('gives each district a distinct palette colour whatever order they come in', () => {
    const a = coloursForGroups(['UPL', 'RVB', 'HLF', 'LKS']);
    const b = coloursForGroups(['LKS', 'HLF', 'RVB', 'UPL', 'RVB']);
    expect([...a]).toEqual([...b]);
    expect(new Set(a.values()).size).toBe(4);
    // Codes in alphabetical order take the palette in order; values from @carbon/colors.
    expect(a.get('HLF')).toBe(blue60);
    expect(a.get('LKS')).toBe(teal50);
  });

  it('reuses colours only after the palette runs out', () => {
    const keys = Array.from({ length: GROUP_PALETTE.length + 1 }, (_, i) => `D${String(i).padStart(2, '0')}`);
    const colours = coloursForGroups(keys);
    expect(new Set(colours.values()).size).toBe(GROUP_PALETTE.length);
    expect(colours.get(keys[GROUP_PALETTE.length])).toBe(colours.get(keys[0]));
  });

  it('uses valid hex colours', () => {
    for (const colour of GROUP_PALETTE) expect(colour).toMatch(/^#[0-9a-f]{6}$/);
  });
});
