/**
 * "Another program": rewrites a plan file in place with a new name, as an editor would.
 * Usage: node externalEdit.mjs <file> <new name>
 */
import { readFileSync, writeFileSync } from 'node:fs';
import process from 'node:process';

const [file, name] = process.argv.slice(2);
if (!file || name === undefined) throw new Error('usage: externalEdit.mjs <file> <new name>');
const plan = JSON.parse(readFileSync(file, 'utf8'));
plan.name = name;
writeFileSync(file, `${JSON.stringify(plan, null, 2)}\n`);
