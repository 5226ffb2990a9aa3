/**
 * A project configuration as the adapter read it → its settings and parts files, and findings
 * placed on the configuration file itself for whatever was left out. Both adapters go through
 * this, so a configuration means the same to the command line and the editor.
 */
import { isRefusal, refusalCode, REFUSAL_SEVERITY, type FileText } from '../circuit/index';
import type { Finding } from '../findings/index';
import { readProjectConfig, type ProjectConfig } from '../ratings/index';

/** The code of every finding about a project configuration's content. */
export const PROJECT_CONFIG_CODE = 'project-config';

export interface ProjectConfigResult {
  uri: string;
  text: string;
  config: ProjectConfig;
  findings: Finding[];
}

export function projectConfigFindings(uri: string, read: FileText): ProjectConfigResult {
  if (typeof read !== 'string') {
    const reason = isRefusal(read) ? read.reason : 'no such file';
    return {
      uri, text: '', config: { settings: {}, partsFiles: [], problems: [] },
      findings: [{ uri, span: { start: 0, end: 0 }, severity: REFUSAL_SEVERITY, code: refusalCode(read, PROJECT_CONFIG_CODE), message: `the configuration ${uri} is not read: ${reason}; none of it applies` }],
    };
  }
  const config = readProjectConfig(read);
  const findings = config.problems.map((p): Finding => ({ uri, span: p.span, severity: 'warning', code: PROJECT_CONFIG_CODE, message: p.message }));
  return { uri, text: read, config, findings };
}
