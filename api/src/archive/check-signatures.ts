import * as layout from '../../../shared/archive/archive-layout';
import type { TArchiveCheck } from '../../../shared/contracts/archives';
import { verifyDetached } from '../services/signing/detached-jws';
import { tryJwkThumbprint } from '../services/signing/jwk-thumbprint';
import type { ReadArchive } from './read-archive-entries';
import type { ResolvedTrust } from './trust-anchor';

export type AddCheck = (check: TArchiveCheck) => void;

/**
 * Checks manifest.jws over manifest.json and every findings signature over its canonical text,
 * against the resolved keys only. Without a trust anchor a signature that matches the archive's
 * own key is reported as `unanchored` (not ok, not tampering): it shows the files were not
 * changed after signing by *some* key, not by whose.
 */
export async function checkSignatures(read: ReadArchive, trust: ResolvedTrust, add: AddCheck): Promise<void> {
  const thumbprintOf = (kid: string | undefined) => {
    const jwk = trust.keys.keys.find((k) => k.kid === kid);
    return jwk ? tryJwkThumbprint(jwk) : null;
  };
  const sign = async (file: string, payloadPath: string) => {
    const jws = read.contents.get(file);
    const payload = read.contents.get(payloadPath);
    const what = payloadPath;
    if (!jws || !payload)
      return add({
        kind: 'signature',
        ok: false,
        file,
        message: `${jws ? payloadPath : file}: missing, so the signature over ${what} cannot be checked`,
      });
    const result = await verifyDetached(jws.toString('utf8').trim(), payload, trust.keys);
    if (!result.valid) {
      return add({
        kind: 'signature',
        ok: false,
        file,
        message: `${file}: signature over ${what} does NOT verify against ${trust.anchored ? 'any trusted key' : `${layout.JWKS_PATH}`} (key ${result.header.kid ?? 'unnamed'}: ${result.error})`,
      });
    }
    const by = `key ${result.header.kid}, thumbprint ${thumbprintOf(result.header.kid)}, signed by ${result.header.signedBy} at ${result.header.signedAt}`;
    if (trust.anchored)
      add({
        kind: 'signature',
        ok: true,
        file,
        message: `${file}: valid signature over ${what} by a trusted key (${by})`,
      });
    else
      add({
        kind: 'signature',
        ok: false,
        unanchored: true,
        file,
        message: `${file}: matches the key inside the archive, NOT a trusted key, over ${what} (${by})`,
      });
  };
  await sign(layout.MANIFEST_SIGNATURE_PATH, layout.MANIFEST_PATH);
  for (const file of [...read.contents.keys()].sort()) {
    const version = layout.versionOfSignaturePath(file);
    if (version !== null) await sign(file, layout.findingsVersionPath(version, 'canonical.json'));
  }
}
