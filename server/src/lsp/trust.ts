/** Workspace trust: in an untrusted workspace no file outside the workspace folders is read. */
export interface TrustPolicy {
  trusted: boolean;
  /** Workspace folder URIs. */
  folders: string[];
}

export function isReadable(uri: string, policy: TrustPolicy): boolean {
  if (policy.trusted) return true;
  const normalised = normalise(uri);
  // Undecodable escapes, and `..` segments (also written with backslashes), are refused outright.
  if (normalised === undefined || normalised.split('/').includes('..')) return false;
  return policy.folders.some((folder) => {
    const root = normalise(folder);
    return root !== undefined && normalised.startsWith(root.replace(/\/?$/, '/'));
  });
}

function normalise(uri: string): string | undefined {
  try {
    return decodeURIComponent(uri).replace(/\\/g, '/').replace(/\/(?:\.\/)+/g, '/');
  } catch {
    return undefined; // a malformed %-escape (decodeURIComponent throws)
  }
}
