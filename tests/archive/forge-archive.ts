import { createHash } from 'node:crypto';
import { CompactSign, exportJWK, generateKeyPair } from 'jose';

/**
 * What an attacker with the archive (but not the server's private key) can do: edit files,
 * re-sign the findings and the manifest with a key of their own, publish that key in
 * keys/jwks.json under the real `kid`, and rewrite the manifest's hashes so every listed file
 * matches again.
 */
export async function forgeArchive(
  entries: Map<string, Buffer>,
  edit: (copy: Map<string, Buffer>, manifest: Record<string, unknown>) => void,
  options: { updatePins?: boolean } = {},
): Promise<Map<string, Buffer>> {
  const copy = new Map([...entries].map(([name, data]) => [name, Buffer.from(data)]));
  const manifest = JSON.parse(copy.get('manifest.json')!.toString('utf8'));
  edit(copy, manifest);
  const realKid = JSON.parse(entries.get('keys/jwks.json')!.toString('utf8')).keys[0].kid as string;
  const { privateKey, publicKey } = await generateKeyPair('EdDSA', { extractable: true });
  const attackerJwk = { ...(await exportJWK(publicKey)), kid: realKid, alg: 'EdDSA', use: 'sig' };
  copy.set('keys/jwks.json', Buffer.from(`${JSON.stringify({ keys: [attackerJwk] }, null, 2)}\n`));
  const signDetached = async (payload: Buffer, typ: string) => {
    const header = {
      alg: 'EdDSA',
      kid: realKid,
      typ,
      signedBy: 'reviewer@driftcase.example',
      signedAt: manifest.exportedAt,
    };
    const [h, , s] = (await new CompactSign(payload).setProtectedHeader(header).sign(privateKey)).split('.');
    return Buffer.from(`${h}..${s}`);
  };
  for (const name of [...copy.keys()]) {
    const match = /^findings\/v(\d+)\/signatures\/.+\.jws$/.exec(name);
    if (match) {
      const canonical = copy.get(`findings/v${match[1]}/canonical.json`);
      if (canonical) copy.set(name, await signDetached(canonical, 'driftcase-findings+jws'));
    }
  }
  if (options.updatePins !== false) {
    const chain = JSON.parse(copy.get('audit/chain.json')!.toString('utf8'));
    if (manifest.auditChain)
      manifest.auditChain = {
        ...manifest.auditChain,
        entries: chain.length,
        headHash: chain.at(-1).entryHash,
      };
    if (manifest.findings) {
      manifest.findings = (manifest.findings as { version: number }[])
        .filter((f) => copy.has(`findings/v${f.version}/canonical.json`))
        .map((f) => ({
          version: f.version,
          signatures: [...copy.keys()].filter((n) => n.startsWith(`findings/v${f.version}/signatures/`))
            .length,
        }));
    }
  }
  manifest.files = [...copy.keys()]
    .filter((name) => name !== 'manifest.json' && name !== 'manifest.jws')
    .map((name) => ({
      path: name,
      size: copy.get(name)!.length,
      sha256: createHash('sha256').update(copy.get(name)!).digest('hex'),
    }));
  const manifestBytes = Buffer.from(`${JSON.stringify(manifest, null, 2)}\n`);
  copy.set('manifest.json', manifestBytes);
  copy.set('manifest.jws', await signDetached(manifestBytes, 'driftcase-archive-manifest+jws'));
  return copy;
}
