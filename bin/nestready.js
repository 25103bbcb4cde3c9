#!/usr/bin/env node
// the bundled command line (scripts/bundle.js): one file to load instead of hundreds
import { main } from '../dist/bundle/cli.js';

await main(process.argv);
