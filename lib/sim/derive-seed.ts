// Independent, named random streams from one study seed: the stream of "W3/bench-fixed/trap/noise"
// does not change when another worker or muscle is added.

/**
 * A 64-bit seed derived from the study seed and a path of names (FNV-1a 64 of the path, XOR seed).
 * @example deriveSeed(1, 'W1', 'bench-fixed', 'trap', 'noise')
 */
export function deriveSeed(seed: number, ...path: string[]): bigint {
  let h = 0xcbf29ce484222325n;
  for (const byte of Buffer.from(path.join('/'), 'utf8')) {
    h ^= BigInt(byte);
    h = BigInt.asUintN(64, h * 0x100000001b3n);
  }
  return BigInt.asUintN(64, h ^ BigInt.asUintN(64, BigInt(seed)));
}
