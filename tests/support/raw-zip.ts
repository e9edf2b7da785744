import { crc32, deflateRawSync } from 'node:zlib';

/**
 * Writes zip bytes by hand (PKWARE APPNOTE 6.3.x, sections 4.3.7, 4.3.12, 4.3.16) so tests can
 * build archives no honest tool would: names with `../`, absolute paths, and directories that lie
 * about sizes.
 */
export interface RawZipEntry {
  name: string;
  data: Buffer;
  method?: 'store' | 'deflate';
  /** Overrides the uncompressed size written to both headers (to make the directory lie). */
  declaredSize?: number;
  /** Already-deflated data (with its CRC-32), for entries too large to hold unpacked. */
  packed?: Buffer;
  crc?: number;
}

export function buildRawZip(entries: RawZipEntry[]): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const entry of entries) {
    const name = Buffer.from(entry.name, 'utf8');
    const isDeflate = (entry.method ?? 'deflate') === 'deflate';
    const packed = entry.packed ?? (isDeflate ? deflateRawSync(entry.data) : entry.data);
    const size = entry.declaredSize ?? entry.data.length;
    const checksum = entry.crc ?? crc32(entry.data);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(0x0800, 6); // UTF-8 names
    local.writeUInt16LE(isDeflate ? 8 : 0, 8);
    local.writeUInt32LE(checksum, 14);
    local.writeUInt32LE(packed.length, 18);
    local.writeUInt32LE(size, 22);
    local.writeUInt16LE(name.length, 26);
    locals.push(local, name, packed);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(0x0800, 8);
    central.writeUInt16LE(isDeflate ? 8 : 0, 10);
    central.writeUInt32LE(checksum, 16);
    central.writeUInt32LE(packed.length, 20);
    central.writeUInt32LE(size, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(offset, 42);
    centrals.push(central, name);
    offset += local.length + name.length + packed.length;
  }
  const directory = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(entries.length, 8);
  end.writeUInt16LE(entries.length, 10);
  end.writeUInt32LE(directory.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, directory, end]);
}
