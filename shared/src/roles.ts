/** The four kinds of staff Stormhour serves. An officer always belongs to one district. */
export const ROLES = ['admin', 'scientist', 'writer', 'officer'] as const;
export type Role = (typeof ROLES)[number];

/** The app's sections, and which roles see each. The server's route guards use the same table. */
export const SECTIONS = [
  'atlas',
  'intake',
  'regimes',
  'outlook',
  'bulletins',
  'inbox',
  'scorecard',
  'admin',
] as const;
export type Section = (typeof SECTIONS)[number];

export const SECTION_ROLES: Record<Section, readonly Role[]> = {
  atlas: ['scientist'],
  intake: ['scientist'],
  regimes: ['scientist'],
  outlook: ['scientist', 'writer'],
  // The administrator reviews bulletins too (an approver other than the author: DESIGN §3.7).
  bulletins: ['scientist', 'writer', 'admin'],
  inbox: ['officer'],
  scorecard: ['scientist', 'admin'],
  admin: ['admin'],
};

export function sectionsFor(role: Role): Section[] {
  return SECTIONS.filter((s) => SECTION_ROLES[s].includes(role));
}

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  scientist: 'Agro-met scientist',
  writer: 'Advisory writer',
  officer: 'Extension officer',
};
