// TypeScript consumer in a CommonJS module (moduleResolution "nodenext", see consumer.ts): the
// package's ES module entry is typed through `require`, as Node runs it on the supported versions.
import quantaband = require('quantaband');

const spectrum = new quantaband.Spectrum({ unit: 'um' });
const radiance: number = spectrum.point(10, 300);
// @ts-expect-error the required module has no such export
quantaband.spectralDensity({ unit: 'um' }, 10, 300);

export = radiance;
