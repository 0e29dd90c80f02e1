// Every screen at the phone viewport: the tests are in screens.mjs (shared with the other device,
// split so node --test runs the two files side by side).
import {defineScreenTests} from './screens.mjs';

defineScreenTests('phone');
