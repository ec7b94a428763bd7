/**
 * Child process for the autosave kill test: writes autosave after autosave, each pairing
 * plan name "Round N" with origin "/plans/round-N.legwise", until it is killed.
 * Usage: tsx autosaveLoop.ts <userDataDir>
 */
import process from 'node:process';
import { newPlan } from '../../../core/plan/defaults.ts';
import { writeAutosave } from '../../../electron/files.ts';

const userData = process.argv[2];
if (!userData) throw new Error('usage: autosaveLoop.ts <userDataDir>');
const base = newPlan();
process.stdout.write('ready\n');
for (let round = 0; ; round++) {
  await writeAutosave(
    userData,
    { ...base, name: `Round ${round}` },
    `/plans/round-${round}.legwise`,
  );
}
