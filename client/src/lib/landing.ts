import { type Role, sectionsFor } from '@stormhour/shared';
import { paths } from '../config/paths';

/** Where a person lands after signing in: the first section their role may open. */
export function landingPathFor(role: Role): string {
  const [first] = sectionsFor(role);
  return first ? paths.section[first] : paths.changePassword;
}
