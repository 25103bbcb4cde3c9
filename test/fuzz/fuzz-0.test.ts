import { fuzzTest } from './suite.js';

fuzzTest(0, 2);
