/**
 * Arrow-key movement in a tab list (WAI-ARIA tabs pattern, common practice): Right/Left
 * step to the next/previous tab and wrap; any other key does nothing (null).
 */
export function tabIndexAfterKey(key: string, index: number, count: number): number | null {
  const step = key === 'ArrowRight' ? 1 : key === 'ArrowLeft' ? -1 : 0;
  if (step === 0 || count <= 0) return null;
  return (index + step + count) % count;
}
