import { type BundleReadResult, createBundleReader, isBundleFileName } from './bundle-reader';
import { feedText, LineTooLongError } from './line-splitter';
import { BUNDLE_FILES } from './types';

/**
 * Validates and reads a bundle given as whole file contents keyed by file name (small inputs,
 * tests, the browser). Large bundles go through the API's streaming `inspectBundle` instead.
 */
export function validateBundleFiles(files: Record<string, string>, issueLimit?: number): BundleReadResult {
  const reader = createBundleReader(issueLimit);
  // The manifest goes first: scans and detections are checked against it.
  if ('manifest.json' in files) reader.readManifest(files['manifest.json']);
  if ('map.json' in files) reader.readMap(files['map.json']);
  for (const name of BUNDLE_FILES) {
    if (name === 'manifest.json' || name === 'map.json' || !(name in files)) continue;
    const sink = reader.openTable(name);
    try {
      feedText(files[name], sink.pushLine);
      sink.finish();
    } catch (error) {
      if (!(error instanceof LineTooLongError)) throw error;
      reader.addIssue({ file: name, line: error.lineNumber, message: error.message });
    }
  }
  for (const name of Object.keys(files)) if (!isBundleFileName(name)) reader.noteExtraFile(name);
  return reader.finish();
}
