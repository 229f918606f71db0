// Section 3: signal → temperature (filled in once the thermometry bindings exist).
import { api } from './api.js';

export const signalSection = {
  id: 'signal',
  available: () => api.has('measuredObjectTemperature'),
  compute() {},
};
