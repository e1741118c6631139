import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { aBlockOutlook, aBulletinContent } from '../../test/bulletinBuilders';
import { BulletinView } from './BulletinView';
import { diffBulletins, VersionDiff } from './VersionDiff';

describe('diffBulletins', () => {
  it('marks only the lines that changed, removed before added (a shortest edit script, Myers 1986, via jsdiff)', () => {
    const before = aBulletinContent();
    const after = aBulletinContent({ generalAdvice: 'Keep livestock away from fences.' });
    const changed = diffBulletins(before, after).filter((l) => l.kind !== 'same');
    expect(changed).toEqual([
      { kind: 'removed', text: 'General advice: Keep livestock away from lone trees.' },
      { kind: 'added', text: 'General advice: Keep livestock away from fences.' },
    ]);
  });

  it('says so when nothing changed', () => {
    render(<VersionDiff before={aBulletinContent()} after={aBulletinContent()} label="Changes" />);
    expect(screen.getByText('No differences.')).toBeTruthy();
  });

  it('lists the changes for screen readers as added and removed', () => {
    const after = aBulletinContent({ outlook: [aBlockOutlook({ afternoonChance: 0.6 })] });
    render(<VersionDiff before={aBulletinContent()} after={after} label="Changes" />);
    const list = screen.getByRole('list', { name: 'Changes' });
    expect(within(list).getAllByText(/^Removed:/).length).toBe(2);
    expect(within(list).getByText(/Outlook · Sallow Ford: 60 %/)).toBeTruthy();
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
