/**
 * Sizes of files in messages. A size over a limit must never read as the limit itself ("256 MiB"
 * for 256 MiB + 1 byte): when rounding would hide the excess, the exact byte count is given.
 */

const MIB = 1024 * 1024;

/** "12.3 MiB", "300 MiB", or "268435457 bytes" when the rounded figure would equal `limit`'s. */
export function formatFileSize(bytes: number, limitBytes?: number): string {
  const rounded = roundedMiB(bytes);
  if (bytes < MIB) return `${bytes} bytes`;
  if (limitBytes !== undefined && bytes !== limitBytes && rounded === roundedMiB(limitBytes)) return `${bytes} bytes`;
  return rounded;
}

function roundedMiB(bytes: number): string {
  const mib = bytes / MIB;
  return `${mib >= 10 ? Math.round(mib) : Number(mib.toPrecision(3))} MiB`;
}

/** "the file is 268435457 bytes, over the 256 MiB limit" — the size and the limit, never equal-looking. */
export function overLimitText(bytes: number, limitBytes: number): string {
  return `${formatFileSize(bytes, limitBytes)}, over the ${formatFileSize(limitBytes)} limit`;
}
