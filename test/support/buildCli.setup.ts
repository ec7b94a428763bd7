/**
 * Vitest global setup: builds dist-cli/legwise.mjs from the current sources once per run, so
 * the tests that start `node bin/legwise.mjs` as a child process exercise today's code, not
 * a bundle left over from an earlier `npm ci`.
 */
// @ts-expect-error -- a plain ES module without type declarations
import { buildCli } from '../../cli/build.mjs';

export default async function setup(): Promise<void> {
  await (buildCli as () => Promise<string>)();
}
