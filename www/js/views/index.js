// The list of views, in tab order. Adding a view = one module here (a spec for viewkit.makeView).
import { lightView } from './light.js';
import { lensView } from './lens.js';
import { encounterView } from './encounter.js';
import { waveformView } from './waveform.js';

export const VIEWS = [lightView, lensView, encounterView, waveformView];
