import { classCount, LATENT_KIND, LATENT_NAMES, type Dataset, type LatentName } from '../collect/dataset.js';

/** Labels of one target on some rows: real outputs for regression, class indices for classification. */
export type TargetLabels =
  | { readonly kind: 'continuous'; readonly values: Float64Array /* [n, outputs] */; readonly outputs: number }
  | { readonly kind: 'categorical'; readonly classes: Int32Array /* [n] */; readonly classCount: number };

/** A target's labels on the rows where it is defined; `keep` lists their positions in the given rows. */
export interface DefinedLabels {
  readonly keep: Int32Array;
  readonly labels: TargetLabels;
}

/** How one latent becomes probe labels. */
export interface ProbeTarget {
  readonly name: LatentName;
  readonly kind: 'continuous' | 'categorical';
  readonly metric: 'r2' | 'accuracy';
  /**
   * Labels for the given dataset rows. A step where the latent is NaN (or, for a class,
   * negative) has no value and is left out of fitting, validation and scoring for this
   * target only (the collector defines every latent at every step, since a world file
   * needs at least one emitter; datasets built elsewhere may not).
   */
  labels(data: Dataset, rows: ArrayLike<number>): DefinedLabels;
}

/** Continuous latents read out as themselves (one ridge output). */
function scalarTarget(name: LatentName): ProbeTarget {
  return {
    name, kind: 'continuous', metric: 'r2',
    labels(data, rows) {
      const keep = definedPositions(data.latents[name], rows, (v) => !Number.isNaN(v));
      const values = Float64Array.from(keep, (p) => data.latents[name][rows[p]]);
      return { keep, labels: { kind: 'continuous', values, outputs: 1 } };
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
      const latent = data.latents[name];
      const keep = definedPositions(latent, rows, (v) => !Number.isNaN(v));
      const values = new Float64Array(keep.length * 2);
      keep.forEach((p, i) => {
        const radians = (latent[rows[p]] * Math.PI) / 180;
        values[2 * i] = Math.sin(radians);
        values[2 * i + 1] = Math.cos(radians);
      });
      return { keep, labels: { kind: 'continuous', values, outputs: 2 } };
    },
  };
}

/** Class-index latents, with the dataset's class count. */
function classTarget(name: LatentName): ProbeTarget {
  return {
    name, kind: 'categorical', metric: 'accuracy',
    labels(data, rows) {
      const latent = data.latents[name];
      const keep = definedPositions(latent, rows, (v) => v >= 0);
      const classes = Int32Array.from(keep, (p) => latent[rows[p]]);
      return { keep, labels: { kind: 'categorical', classes, classCount: classCount(data, name) } };
    },
  };
}

function definedPositions(latent: Float32Array, rows: ArrayLike<number>, defined: (v: number) => boolean): Int32Array {
  const keep: number[] = [];
  for (let p = 0; p < rows.length; p++) if (defined(latent[rows[p]])) keep.push(p);
  return Int32Array.from(keep);
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
