import { classCount, LATENT_KIND, LATENT_NAMES, type Dataset, type LatentName } from '../collect/dataset.js';

/** Labels of one target on some rows: real outputs for regression, class indices for classification. */
export type TargetLabels =
  | { readonly kind: 'continuous'; readonly values: Float64Array /* [n, outputs] */; readonly outputs: number }
  | { readonly kind: 'categorical'; readonly classes: Int32Array /* [n] */; readonly classCount: number };

/** How one latent becomes probe labels. */
export interface ProbeTarget {
  readonly name: LatentName;
  readonly kind: 'continuous' | 'categorical';
  readonly metric: 'r2' | 'accuracy';
  /**
   * Labels for the given dataset rows. The collector defines every latent at every step
   * (a world file needs at least one emitter), so a NaN value, or a negative class, is
   * refused with the target and step it was found at.
   */
  labels(data: Dataset, rows: ArrayLike<number>): TargetLabels;
}

/** Continuous latents read out as themselves (one ridge output). */
function scalarTarget(name: LatentName): ProbeTarget {
  return {
    name, kind: 'continuous', metric: 'r2',
    labels(data, rows) {
      const latent = definedLatent(data, name, rows, (v) => !Number.isNaN(v));
      const values = new Float64Array(rows.length);
      for (let i = 0; i < rows.length; i++) values[i] = latent[rows[i]];
      return { kind: 'continuous', values, outputs: 1 };
    },
  };
}

/**
 * Azimuth in degrees read out as [sin, cos] (two ridge outputs): the angle wraps at
 * ±180°, so a linear read-out of the raw degrees would be asked to jump there.
 */
function angleTarget(name: LatentName): ProbeTarget {
  return {
    name, kind: 'continuous', metric: 'r2',
    labels(data, rows) {
      const latent = definedLatent(data, name, rows, (v) => !Number.isNaN(v));
      const values = new Float64Array(rows.length * 2);
      for (let i = 0; i < rows.length; i++) {
        const radians = (latent[rows[i]] * Math.PI) / 180;
        values[2 * i] = Math.sin(radians);
        values[2 * i + 1] = Math.cos(radians);
      }
      return { kind: 'continuous', values, outputs: 2 };
    },
  };
}

/** Class-index latents, with the dataset's class count. */
function classTarget(name: LatentName): ProbeTarget {
  return {
    name, kind: 'categorical', metric: 'accuracy',
    labels(data, rows) {
      const latent = definedLatent(data, name, rows, (v) => v >= 0);
      const classes = new Int32Array(rows.length);
      for (let i = 0; i < rows.length; i++) classes[i] = latent[rows[i]];
      return { kind: 'categorical', classes, classCount: classCount(data, name) };
    },
  };
}

/** The latent's values, after checking that it is defined on every given row. */
function definedLatent(data: Dataset, name: LatentName, rows: ArrayLike<number>, defined: (v: number) => boolean): Float32Array {
  const latent = data.latents[name];
  for (let i = 0; i < rows.length; i++) {
    if (!defined(latent[rows[i]])) throw new Error(`probe target '${name}' has no value at step ${rows[i]} (${latent[rows[i]]}); every latent must be defined at every step`);
  }
  return latent;
}

/** Every latent as a probe target: azimuth as [sin, cos], the rest by LATENT_KIND. */
export const PROBE_TARGETS: Readonly<Record<LatentName, ProbeTarget>> = Object.fromEntries(
  LATENT_NAMES.map((name) => [
    name,
    name === 'nearest_azimuth_deg' ? angleTarget(name) : LATENT_KIND[name] === 'continuous' ? scalarTarget(name) : classTarget(name),
  ]),
) as Record<LatentName, ProbeTarget>;

/** The target of a name, or a one-line error listing the valid names. */
export function probeTarget(name: string): ProbeTarget {
  if (!(LATENT_NAMES as readonly string[]).includes(name)) {
    throw new Error(`probe target '${name}' is unknown; expected one of ${LATENT_NAMES.join(', ')}`);
  }
  return PROBE_TARGETS[name as LatentName];
}
