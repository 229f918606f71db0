// Section 5: calibration curve and frame conversion (filled in once the bindings exist).
import { api } from './api.js';

export const calibSection = {
  id: 'calib',
  available: () => api.has('fitSakumaHattori'),
  compute() {},
};
