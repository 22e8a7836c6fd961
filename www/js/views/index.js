// The list of views, in tab order. Adding a view = one module here.
import { lightView } from './light.js';
import { lensView } from './lens.js';
import { encounterView } from './encounter.js';
import { radiationView } from './radiation.js';

export const VIEWS = [lightView, lensView, encounterView, radiationView];
