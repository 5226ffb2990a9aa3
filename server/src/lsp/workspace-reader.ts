/**
 * The language server's `readText`: an open document's text as the editor has it, else the disk
 * through the trust gate and the safe reader. Plain functions of plain data, so an analysis worker
 * can build the same reader from the policy and the open texts it is sent.
 */
import { isRefusal, type FileText } from '../circuit/index';
import { readFileSafely } from '../io/read-file-safely';
import { gateUri, type TrustPolicy } from './trust';

export interface WorkspaceReaderSources {
  /** The text of an open document, which is read whatever the trust. */
  openText: (uri: string) => string | undefined;
  trust: () => TrustPolicy;
  /** The file-size cap in bytes (the safe reader's default when absent). */
  maxBytes?: number;
}

export function createWorkspaceReader(sources: WorkspaceReaderSources): (uri: string) => FileText {
  return (uri) => {
    const open = sources.openText(uri);
    if (open !== undefined) return open;
    const policy = sources.trust();
    const gate = gateUri(uri, policy);
    if (isRefusal(gate)) return gate;
    // Untrusted, the gate resolved every link; a final link appearing after that is refused.
    return readFileSafely(gate.path, { maxBytes: sources.maxBytes, noFollow: !policy.trusted });
  };
}
