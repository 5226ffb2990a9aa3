/** Placeholder entry until the language server lands (issue 6). */
export {};
