/** The version stamped into reports; esbuild replaces `RECTILENS_VERSION` at bundle time. */
declare const RECTILENS_VERSION: string | undefined;

export const TOOL_VERSION = typeof RECTILENS_VERSION === 'string' ? RECTILENS_VERSION : '0.0.0-dev';
