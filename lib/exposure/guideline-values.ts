// Literature values used as context in reports: Jonsson's historical APDF guideline values and
// published ranges from occupational trapezius/forearm studies (METHODS.md §1.3 and §9).
// These are historical guideline values and study-specific ranges: context, not limits.

export interface GuidelineLevel {
  /** APDF probability level, %. */
  q: number;
  /** Name of the load level. */
  level: 'static' | 'median' | 'peak';
  /** "Should not exceed" value, %MVC as published. */
  should_not_exceed: number;
  /** "Must not exceed" value, %MVC as published. */
  must_not_exceed: number;
}

/**
 * Jonsson's suggested APDF guideline values for work lasting ≥ 1 h, in %MVC.
 * Evidence: FROM MEMORY (METHODS.md §1.3) — verify against the 1982 paper before quoting;
 * historical guideline values, context, not limits.
 */
export const JONSSON_GUIDELINES = {
  citation: 'Jonsson B. 1982. Measurement and evaluation of local muscular strain in the shoulder during constrained work. J Hum Ergol (Tokyo) 11(1):73–88',
  short: 'Jonsson (1982, quoted from memory)',
  evidence: 'FROM MEMORY',
  note: 'historical guideline values, context, not limits',
  levels: [
    { q: 10, level: 'static', should_not_exceed: 2, must_not_exceed: 5 },
    { q: 50, level: 'median', should_not_exceed: 10, must_not_exceed: 14 },
    { q: 90, level: 'peak', should_not_exceed: 50, must_not_exceed: 70 },
  ] as readonly GuidelineLevel[],
} as const;

export interface ReferenceRange {
  id: string;
  /** Which measure the range is about. */
  measure: 'p10' | 'p90' | 'gaps_per_min' | 'rest_pct';
  muscle_group: 'trapezius' | 'forearm extensors';
  unit: string;
  low: number;
  high: number;
  /** Central value when reported (median or mean), else null. */
  central: number | null;
  central_kind: 'median' | 'mean' | null;
  population: string;
  short: string;
  citation: string;
  evidence: 'FOUND';
}

/** Published ranges (METHODS.md §9; all FOUND in abstracts or bibliographic records). */
export const REFERENCE_RANGES: readonly ReferenceRange[] = [
  {
    id: 'veiersted1990-gaps', measure: 'gaps_per_min', muscle_group: 'trapezius', unit: 'gaps/min',
    low: 0.8, high: 20, central: 4.8, central_kind: 'median', population: '10 packing-machine workers',
    short: 'Veiersted et al. (1990)',
    citation: 'Veiersted KB, Westgaard RH, Andersen P. 1990. Pattern of muscle activity during stereotyped work and its relation to muscle pain. Int Arch Occup Environ Health 62(1):31–41. doi 10.1007/BF00397846',
    evidence: 'FOUND',
  },
  {
    id: 'veiersted1990-static', measure: 'p10', muscle_group: 'trapezius', unit: '%MVC',
    low: 0.4, high: 2.5, central: 1.6, central_kind: 'median', population: '10 packing-machine workers',
    short: 'Veiersted et al. (1990)',
    citation: 'Veiersted KB, Westgaard RH, Andersen P. 1990. Int Arch Occup Environ Health 62(1):31–41. doi 10.1007/BF00397846',
    evidence: 'FOUND',
  },
  {
    id: 'nordander2000-rest-cleaners', measure: 'rest_pct', muscle_group: 'trapezius', unit: '% time',
    low: 0.2, high: 13, central: 1.5, central_kind: 'median', population: '24 female cleaners',
    short: 'Nordander et al. (2000)',
    citation: 'Nordander C et al. 2000. Ergonomics 43(11):1904–1919 (https://lup.lub.lu.se/record/1118438)',
    evidence: 'FOUND',
  },
  {
    id: 'nordander2000-rest-office', measure: 'rest_pct', muscle_group: 'trapezius', unit: '% time',
    low: 0.0, high: 32, central: 12, central_kind: 'median', population: '34 office workers',
    short: 'Nordander et al. (2000)',
    citation: 'Nordander C et al. 2000. Ergonomics 43(11):1904–1919 (https://lup.lub.lu.se/record/1118438)',
    evidence: 'FOUND',
  },
  {
    id: 'hansson2010-rest', measure: 'rest_pct', muscle_group: 'trapezius', unit: '% time',
    low: 0.8, high: 52, central: null, central_kind: null, population: '43 types of work, 713 persons (group values)',
    short: 'Hansson et al. (2010)',
    citation: 'Hansson GÅ et al. 2010. Int J Ind Ergon 40(3):267–281 (http://www.lu.se/lup/publication/1617489)',
    evidence: 'FOUND',
  },
  {
    id: 'hansson2010-p90', measure: 'p90', muscle_group: 'trapezius', unit: '% max EMG',
    low: 3.1, high: 24, central: null, central_kind: null, population: '43 types of work, 713 persons (group values)',
    short: 'Hansson et al. (2010)',
    citation: 'Hansson GÅ et al. 2010. Int J Ind Ergon 40(3):267–281 (http://www.lu.se/lup/publication/1617489)',
    evidence: 'FOUND',
  },
  {
    id: 'hansson2009-rest', measure: 'rest_pct', muscle_group: 'forearm extensors', unit: '% time',
    low: 0.2, high: 23, central: null, central_kind: null, population: '43 types of work, 686 persons (group values)',
    short: 'Hansson et al. (2009)',
    citation: 'Hansson GÅ et al. 2009. Int J Ind Ergon 39(1):221–233 (https://lup.lub.lu.se/record/1311457)',
    evidence: 'FOUND',
  },
  {
    id: 'hansson2009-p90', measure: 'p90', muscle_group: 'forearm extensors', unit: '% max EMG',
    low: 3.4, high: 41, central: null, central_kind: null, population: '43 types of work, 686 persons (group values)',
    short: 'Hansson et al. (2009)',
    citation: 'Hansson GÅ et al. 2009. Int J Ind Ergon 39(1):221–233 (https://lup.lub.lu.se/record/1311457)',
    evidence: 'FOUND',
  },
];
