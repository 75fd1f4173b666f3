import { clean, TorquePlanError } from './errors';

export type TireConstruction = 'radial' | 'bias' | 'belted';
export type TireSize = {
  inches: number;
  kind: 'flotation' | 'metric';
  construction: TireConstruction;
  rimInches: number;
  widthInches: number;
};

const ACCEPTED =
  'Use the size as printed on the sidewall: a flotation size such as 30x10-14, 35x12.50R17LT, 30x10-14 6PR or AT25x8-12, or a metric size such as 265/70R17, 315/70R17 121Q or LT285/70R17.';

const CONSTRUCTION: Record<string, TireConstruction> = {
  R: 'radial',
  ZR: 'radial',
  '-': 'bias',
  D: 'bias',
  B: 'belted',
};

// 30x10-14, 30x10R14, 30x10.00-14, 30 x 10.00 R 14: overall diameter × section width, rim.
// A service-type prefix (LT, AT) may come first; see `sizeCore` for the markings after it.
const FLOTATION =
  /^(?:LT|AT)?\s*(\d{2}(?:\.\d{1,2})?)\s*[xX]\s*(\d{1,2}(?:\.\d{1,2})?)\s*(R|-|D|B)\s*(\d{1,2}(?:\.\d)?)$/i;

/**
 * The sidewall's markings that do not change the diameter, taken off the end so the size itself
 * is left: a service type (35x12.50R17LT), a ply rating (30x10-14 6PR), a load index with speed
 * rating (315/70R17 121Q, or dual 121/118Q), an extra-load mark (XL).
 */
const TRAILING = /(?:\s*LT|\s+\d{1,2}\s*PR|\s+\d{2,3}(?:\/\d{2,3})?\s?[A-HJ-NP-Z]|\s+XL)$/i;
function sizeCore(size: string): string {
  let s = size.trim().replace(/\s+/g, ' ');
  for (let i = 0; i < 4 && TRAILING.test(s); i++) s = s.replace(TRAILING, '').trim();
  return s;
}
// 265/70R17, LT285/70R17, P225/60R16: width mm / aspect % construction rim in.
const METRIC = /^(P|LT|ST|T)?\s*(\d{3})\s*\/\s*(\d{2,3})\s*(ZR|R|-|D|B)\s*(\d{2}(?:\.\d)?)$/i;

/**
 * Overall diameter in inches, from the size as printed on the sidewall (load index, speed rating,
 * ply rating and the LT/P/AT service marks are ignored). Flotation sizes state it (the first
 * number, nominal). Metric sizes follow the metric sizing convention of the Tire and Rim
 * Association and ETRTO (from memory): section width in mm, aspect ratio as the sidewall's height
 * in percent of the width, rim in inches, so diameter = rim + 2 × width × aspect / 100 / 25.4
 * (265/70R17 → 31.61 in; 25.4 mm per inch exactly, NIST SP 811 App. B).
 */
export function tireDiameter(size: string): TireSize {
  if (typeof size !== 'string')
    throw new TorquePlanError(`A tire size must be text. ${ACCEPTED}`, 'size');
  if (size.length > 60)
    throw new TorquePlanError(`A tire size is at most 60 characters. ${ACCEPTED}`, 'size');
  const s = sizeCore(size);
  const f = FLOTATION.exec(s);
  if (f) {
    const [, diameter, width, construction, rim] = f;
    const inches = Number(diameter);
    const rimInches = Number(rim);
    if (rimInches >= inches)
      throw new TorquePlanError(
        `"${s}": the rim cannot be as large as the tire. ${ACCEPTED}`,
        'size',
      );
    return {
      inches,
      kind: 'flotation',
      construction: CONSTRUCTION[construction!.toUpperCase()]!,
      rimInches,
      widthInches: Number(width),
    };
  }
  const m = METRIC.exec(s);
  if (m) {
    const [, , width, aspect, construction, rim] = m;
    const widthMm = Number(width);
    const rimInches = Number(rim);
    const sidewall = (widthMm * Number(aspect)) / 100 / 25.4;
    return {
      inches: clean(rimInches + 2 * sidewall),
      kind: 'metric',
      construction: CONSTRUCTION[construction!.toUpperCase()]!,
      rimInches,
      widthInches: clean(widthMm / 25.4),
    };
  }
  throw new TorquePlanError(`Unknown tire size "${s}". ${ACCEPTED}`, 'size');
}

/**
 * Compares tires that should match (one axle, or all four on an all-wheel-drive vehicle):
 * spread of overall diameter (= spread of circumference) in percent of the smallest, the
 * circumference difference in inches, and whether constructions differ.
 */
export function axleMismatch(
  sizes: readonly string[],
  thresholdPct: number,
): {
  mismatched: boolean;
  spreadPct: number;
  circumferenceSpreadInches: number;
  constructionDiffers: boolean;
} {
  if (!Array.isArray(sizes) || sizes.length < 2)
    throw new TorquePlanError('Compare at least two tire sizes.', 'sizes');
  if (typeof thresholdPct !== 'number' || !Number.isFinite(thresholdPct) || thresholdPct < 0) {
    throw new TorquePlanError(
      'The threshold must be a percentage of zero or more.',
      'thresholdPct',
    );
  }
  const tires = sizes.map((s) => tireDiameter(s));
  const diameters = tires.map((t) => t.inches);
  const min = Math.min(...diameters);
  const max = Math.max(...diameters);
  const spreadPct = clean(((max - min) / min) * 100);
  const constructionDiffers = new Set(tires.map((t) => t.construction)).size > 1;
  return {
    mismatched: spreadPct > thresholdPct + 1e-9 || constructionDiffers,
    spreadPct,
    circumferenceSpreadInches: clean((max - min) * Math.PI),
    constructionDiffers,
  };
}

/** A circumference allowance (common practice for AWD, no source: 1/4 in) as a percent of a tire. */
export function circumferenceAllowancePct(allowanceInches: number, diameterInches: number): number {
  return clean((allowanceInches / (Math.PI * diameterInches)) * 100);
}
