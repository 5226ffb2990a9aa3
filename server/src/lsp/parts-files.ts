/** Reads the parts files named in the settings (paths relative to the first workspace folder). */
import { validatePartsFile, type PartsFile } from '../ratings/index';
import type { TrustPolicy } from './trust';

export function readPartsFiles(paths: readonly string[], trust: TrustPolicy, readText: (uri: string) => string | undefined): PartsFile[] {
  const folder = trust.folders[0];
  const files: PartsFile[] = [];
  for (const path of paths) {
    const uri = /^[a-z]+:/i.test(path) ? path : folder ? `${folder.replace(/\/$/, '')}/${path.replace(/^\.?\//, '')}` : undefined;
    const text = uri ? readText(uri) : undefined;
    if (!uri || text === undefined) continue;
    try {
      files.push(validatePartsFile(JSON.parse(text), uri).file);
    } catch {
      // A parts file that is not JSON contributes nothing; the JSON schema shows the user why.
    }
  }
  return files;
}
