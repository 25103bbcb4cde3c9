import { fuzzTest } from './suite.js';

fuzzTest(1, 2);
