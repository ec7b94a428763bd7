/** Types for build.mjs. */
export function buildElectron(options?: {
  root?: string;
  outDir?: string;
}): Promise<{ main: string; preload: string }>;
