import { crc32, deflateRawSync } from 'node:zlib';

/**
 * A zip archive with its files stored uncompressed (PKWARE APPNOTE 6.3: local headers, central
 * directory, end record), for test fixtures; `deflate` compresses a file instead. `claimSize`
 * overrides the unpacked size written in the headers, to make hostile archives.
 */
export function storeZip(files: { name: string; data: Buffer; claimSize?: number; deflate?: boolean }[]): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const file of files) {
    const name = Buffer.from(file.name, 'utf8');
    const crc = crc32(file.data);
    const size = file.claimSize ?? file.data.length;
    const packed = file.deflate ? deflateRawSync(file.data) : file.data;
    const method = file.deflate ? 8 : 0;
    // the local header and the central directory hold the same fields, at offsets 2 apart
    const describe = (header: Buffer, at: number) => {
      header.writeUInt16LE(method, at - 6);
      header.writeUInt32LE(crc, at);
      header.writeUInt32LE(packed.length, at + 4);
      header.writeUInt32LE(size, at + 8);
      header.writeUInt16LE(name.length, at + 12);
    };
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    describe(local, 14);
    locals.push(local, name, packed);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    describe(central, 16);
    central.writeUInt32LE(offset, 42);
    centrals.push(central, name);
    offset += 30 + name.length + packed.length;
  }
  const directory = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(files.length, 8);
  end.writeUInt16LE(files.length, 10);
  end.writeUInt32LE(directory.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, directory, end]);
}
