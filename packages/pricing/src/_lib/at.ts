/**
 * The element at index `i` of an array the caller knows holds it; throws a
 * clear error if it does not (a broken invariant, never bad input), so that
 * code under `noUncheckedIndexedAccess` need not assert blindly.
 *
 * @example
 * at([3, 5], 1) // 5
 * at([3, 5], 2) // throws RangeError('internal: index 2 out of range (length 2)')
 */
export function at<T>(arr: ArrayLike<T>, i: number): T {
  const v = arr[i];
  if (v === undefined) throw new RangeError(`internal: index ${i} out of range (length ${arr.length})`);
  return v;
}
