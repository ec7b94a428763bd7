/** Types for launch.mjs (plain JS so that `node electron/start.mjs` needs no compiler). */
type Env = Record<string, string | undefined>;
interface Probe {
  electronDir: string | null;
  env?: Env;
  exists?: (file: string) => boolean;
  readText?: (file: string) => string;
}
export function fallbackLine(url: string): string;
export function resolveElectronDir(projectRoot: string): string | null;
export function findElectronBinary(
  probe: Probe,
): { ok: true; binary: string } | { ok: false; reason: string };
export function hasDisplay(options?: { platform?: NodeJS.Platform; env?: Env }): boolean;
export function launchDecision(
  probe: Probe & { platform?: NodeJS.Platform },
): { mode: 'electron'; binary: string } | { mode: 'browser'; reason: string };
export function ensureBuilt(options: {
  root: string;
  configFile?: string | false;
  log?: (line: string) => void;
}): Promise<boolean>;
export function serveRenderer(options: {
  root: string;
  configFile?: string | false;
  port?: number;
  log?: (line: string) => void;
}): Promise<{ url: string; kind: 'preview'; built: boolean; close: () => Promise<void> }>;
export function viteProject(
  root: string,
  configFile?: string | false,
): { configFile: string } | { root: string; configFile: false };
export function electronChildEnv(env?: Env): Env;
