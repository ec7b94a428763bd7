#!/usr/bin/env node
// The `legwise` command: registers tsx so Node can load the TypeScript sources, then runs the CLI.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../cli/main.ts');
main();
