import type { BulletinTextDiff } from '@stormhour/shared';
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { aBulletinContent } from '../../test/bulletinBuilders';
import { BulletinView } from './BulletinView';
import { VersionDiff } from './VersionDiff';

const diff: BulletinTextDiff = {
  against: { bulletinId: 3, number: 'RVB-2025-26', version: 2 },
  lines: [
    { op: 'same', text: 'Riverbend crop-weather bulletin' },
    { op: 'removed', text: 'Keep livestock away from lone trees.' },
    { op: 'added', text: 'Keep livestock away from fences.' },
  ],
  added: 1,
  removed: 1,
};

describe('VersionDiff', () => {
  it('lists only the changed lines, spoken as added and removed', () => {
    render(<VersionDiff diff={diff} label="Changes" />);
    const list = screen.getByRole('list', { name: 'Changes' });
    expect(
      within(list)
        .getAllByRole('listitem')
        .map((li) => li.textContent),
    ).toEqual(['−Removed: Keep livestock away from lone trees.', '+Added: Keep livestock away from fences.']);
    expect(screen.getByText('1 line added, 1 removed.')).toBeTruthy();
  });

  it('says when there is nothing to compare with, or nothing changed', () => {
    const { rerender } = render(
      <VersionDiff diff={{ against: null, lines: [], added: 0, removed: 0 }} label="Changes" />,
    );
    expect(screen.getByText('Nothing to compare with yet.')).toBeTruthy();
    rerender(
      <VersionDiff diff={{ ...diff, lines: [diff.lines[0]], added: 0, removed: 0 }} label="Changes" />,
    );
    expect(screen.getByText('No differences.')).toBeTruthy();
  });
});

describe('BulletinView', () => {
  it('shows every part an officer reads, with the cautions, and raw HTML only as text', () => {
    const content = aBulletinContent({ summary: '**Storms likely** <b>not bold</b>' });
    const { container } = render(<BulletinView content={content} />);
    expect(
      screen.getByRole('heading', { name: 'Riverbend: crop-weather bulletin RVB-2025-27' }),
    ).toBeTruthy();
    const outlook = screen.getByRole('table', { name: 'Afternoon storm chance by block' });
    const sallow = within(outlook).getByRole('row', { name: /Sallow Ford/ });
    expect(sallow.textContent).toContain('52 %');
    expect(sallow.textContent).toContain('+27 points (usual 25 %)');
    expect(within(outlook).getByRole('row', { name: /Marrow Bend/ }).textContent).toContain('no data');
    expect(container.querySelector('strong')?.textContent).toBe('moist / onshore');
    expect(screen.getByText('Storms likely').tagName).toBe('STRONG');
    expect(container.querySelector('b')).toBeNull();
    expect(screen.getByText(/<b>not bold<\/b>/)).toBeTruthy();
    expect(screen.getByText(/not an official weather warning/)).toBeTruthy();
  });
});
