/** Limits that keep a hostile or broken .zip from exhausting disk or memory. */
export interface ZipLimits {
  /** Refuse a zip whose entries unpack to more than this in total, bytes. */
  maxTotalBytes: number;
  /** An entry larger than this, bytes... */
  maxEntryBytes: number;
  /** ...is refused when it also unpacks more than this many times its packed size. */
  maxRatio: number;
}

/**
 * A real occupancy map can compress 500:1, but it is small; a log past 64 MiB that compresses
 * over 100:1 is not a log. 4 GiB total is far above a day of recording.
 */
export const DEFAULT_ZIP_LIMITS: ZipLimits = {
  maxTotalBytes: 4 * 1024 ** 3,
  maxEntryBytes: 64 * 1024 ** 2,
  maxRatio: 100,
};
