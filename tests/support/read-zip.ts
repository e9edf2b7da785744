import yauzl from 'yauzl';

/** Every entry of a zip file, name → bytes (tests only: the whole archive in memory). */
export async function readZip(file: string): Promise<Map<string, Buffer>> {
  const zip = await yauzl.openPromise(file, { lazyEntries: true });
  const out = new Map<string, Buffer>();
  for await (const entry of zip.eachEntry()) {
    const chunks: Buffer[] = [];
    for await (const chunk of await zip.openReadStreamPromise(entry)) chunks.push(chunk as Buffer);
    out.set(entry.fileName, Buffer.concat(chunks));
  }
  return out;
}
