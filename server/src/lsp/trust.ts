/** Workspace trust: in an untrusted workspace no file outside the workspace folders is read. */
export interface TrustPolicy {
  trusted: boolean;
  /** Workspace folder URIs. */
  folders: string[];
}

export function isReadable(uri: string, policy: TrustPolicy): boolean {
  if (policy.trusted) return true;
  const normalised = normalise(uri);
  if (normalised.split('/').includes('..')) return false;
  return policy.folders.some((folder) => normalised.startsWith(normalise(folder).replace(/\/?$/, '/')));
}

function normalise(uri: string): string {
  return decodeURIComponent(uri).replace(/\/\.\//g, '/');
}
