/** "14.20° N, 88.10° E": hemispheres in words rather than signs, as maps print them. */
export function formatLocation(lat: number, lon: number): string {
  const ns = `${Math.abs(lat).toFixed(2)}° ${lat < 0 ? 'S' : 'N'}`;
  const ew = `${Math.abs(lon).toFixed(2)}° ${lon < 0 ? 'W' : 'E'}`;
  return `${ns}, ${ew}`;
}
