/** Placeholder entry until the VS Code client lands (issue 6). */
export function activate(): void {}
export function deactivate(): void {}
