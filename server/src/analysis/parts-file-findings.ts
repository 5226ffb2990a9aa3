/**
 * A parts file as the adapter read it → its usable entries and the findings about it, placed on
 * the parts file itself. A file that could not be read (untrusted, missing, a folder, too large)
 * gives one finding with the gate's reason; one that is not valid JSON, or of another version,
 * gives its ratings to nothing and says so.
 */
import { isRefusal, refusalCode, REFUSAL_SEVERITY, type FileText } from '../circuit/index';
import { readPartsFileText, type PartsFile } from '../ratings/index';
import type { Finding } from '../findings/index';

/** The code of every finding about a parts file's content. */
export const PARTS_FILE_CODE = 'parts-file';

export interface PartsFileResult {
  uri: string;
  /** The text the findings' offsets refer to (empty when nothing was read). */
  text: string;
  file?: PartsFile;
  findings: Finding[];
}

export function partsFileFindings(uri: string, read: FileText): PartsFileResult {
  if (typeof read !== 'string') {
    const reason = isRefusal(read) ? read.reason : 'no such file';
    const finding: Finding = {
      uri, span: { start: 0, end: 0 }, severity: REFUSAL_SEVERITY, code: refusalCode(read, PARTS_FILE_CODE),
      message: `the parts file ${uri} is not read: ${reason}; none of its ratings are used`,
    };
    return { uri, text: '', findings: [finding] };
  }
  const { file, problems } = readPartsFileText(read, uri);
  const findings = problems.map((p): Finding => ({ uri, span: p.span, severity: p.severity, code: PARTS_FILE_CODE, message: p.message }));
  return { uri, text: read, file, findings };
}
