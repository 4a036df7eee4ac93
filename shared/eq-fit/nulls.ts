/** A narrow, deep dip in a response: likely a cancellation that EQ cannot fill. */
export interface ResponseNull {
  frequencyHz: number;
  /** Depth below the target at the bottom of the dip, dB (positive). */
  depthDb: number;
  /** Width where the dip is deeper than half its depth (in dB), octaves. */
  widthOctaves: number;
  /** Grid indices [first, last] of the whole dip: where it lies more than 3 dB below the target. */
  first: number;
  last: number;
}

/** A dip counts as a null when at least this deep below the target, dB [product choice]. */
export const NULL_MIN_DEPTH_DB = 6;
/** ...and no wider than this at half its depth, octaves [product choice]. */
export const NULL_MAX_WIDTH_OCTAVES = 1 / 3;

/**
 * Narrow deep dips of an error curve (measured − target, dB) on an ascending frequency grid: a local
 * minimum at least {@link NULL_MIN_DEPTH_DB} below the target whose region deeper than half the minimum
 * spans at most {@link NULL_MAX_WIDTH_OCTAVES}. Boosting into such a dip spends amplifier and driver
 * headroom on a cancellation that moves with the listener [practice].
 */
export function findNulls(frequenciesHz: readonly number[], errorDb: ArrayLike<number>): ResponseNull[] {
  const nulls: ResponseNull[] = [];
  const n = frequenciesHz.length;
  let i = 0;
  while (i < n) {
    const isMinimum =
      errorDb[i] <= -NULL_MIN_DEPTH_DB &&
      (i === 0 || errorDb[i] <= errorDb[i - 1]) &&
      (i === n - 1 || errorDb[i] <= errorDb[i + 1]);
    if (!isMinimum) {
      i++;
      continue;
    }
    const regionAround = (centre: number): [number, number] => {
      const half = errorDb[centre] / 2;
      let from = centre;
      while (from > 0 && errorDb[from - 1] < half) from--;
      let to = centre;
      while (to < n - 1 && errorDb[to + 1] < half) to++;
      return [from, to];
    };
    // The bottom of a dip with several local minima is its deepest point.
    let [first, last] = regionAround(i);
    let bottom = i;
    for (let k = first; k <= last; k++) if (errorDb[k] < errorDb[bottom]) bottom = k;
    if (bottom !== i) [first, last] = regionAround(bottom);
    const lowerHz =
      first > 0 ? Math.sqrt(frequenciesHz[first - 1] * frequenciesHz[first]) : frequenciesHz[first];
    const upperHz =
      last < n - 1 ? Math.sqrt(frequenciesHz[last] * frequenciesHz[last + 1]) : frequenciesHz[last];
    const widthOctaves = Math.log2(upperHz / lowerHz);
    if (widthOctaves <= NULL_MAX_WIDTH_OCTAVES) {
      // The shoulders belong to the dip too: a boost there would still spend headroom on the cancellation.
      let outerFirst = first;
      while (outerFirst > 0 && errorDb[outerFirst - 1] < -NULL_MIN_DEPTH_DB / 2) outerFirst--;
      let outerLast = last;
      while (outerLast < n - 1 && errorDb[outerLast + 1] < -NULL_MIN_DEPTH_DB / 2) outerLast++;
      nulls.push({
        frequencyHz: frequenciesHz[bottom],
        depthDb: -errorDb[bottom],
        widthOctaves,
        first: outerFirst,
        last: outerLast,
      });
      last = outerLast;
    }
    i = Math.max(i, last) + 1;
  }
  return nulls;
}
