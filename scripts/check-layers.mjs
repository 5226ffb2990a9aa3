#!/usr/bin/env node
/**
 * The layer lint: every import in the product's source must be an arrow the contributor guide
 * allows. The rules are the table "Rooms and what each may import" in DEVELOPERS.md, read from
 * there, so the prose and the check cannot drift apart. Run by `npm test`
 * (tests/architecture/layers.test.ts) and by hand with `npm run lint:layers`.
 *
 * A room's row names its folder and what it may import: other rooms by name, packages in
 * backticks (`node:` allows Node's built-ins, a package name allows its subpaths), `nothing`
 * for neither. A room may always import itself. Type-only imports count like any other: a room
 * that needs another's types depends on it.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join, posix, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';

const TABLE_HEADING = '## Rooms and what each may import';

/**
 * @typedef {{ name: string; folder: string; rooms: string[]; packages: string[] }} Room
 * @typedef {{ file: string; line: number; specifier: string; message: string }} Violation
 */

/** The rooms table of the contributor guide. */
export function readRooms(markdown) {
  const start = markdown.indexOf(TABLE_HEADING);
  if (start < 0) throw new Error(`DEVELOPERS.md has no "${TABLE_HEADING}" section`);
  const rows = markdown.slice(start).split('\n').slice(1);
  /** @type {Room[]} */
  const rooms = [];
  let inTable = false;
  for (const row of rows) {
    if (!row.startsWith('|')) {
      if (inTable) break;
      continue;
    }
    inTable = true;
    const cells = row.split('|').slice(1, -1).map((c) => c.trim());
    if (cells.length < 4 || cells[0] === 'room' || /^-+$/.test(cells[0])) continue;
    const [name, folderCell, , importsCell] = cells;
    const folder = folderCell.replace(/`/g, '').replace(/\/$/, '');
    const tokens = importsCell === 'nothing' ? [] : importsCell.split(',').map((t) => t.trim()).filter(Boolean);
    rooms.push({
      name,
      folder,
      rooms: tokens.filter((t) => !t.startsWith('`')),
      packages: tokens.filter((t) => t.startsWith('`')).map((t) => t.replace(/`/g, '')),
    });
  }
  const names = new Set(rooms.map((r) => r.name));
  for (const room of rooms) {
    for (const other of room.rooms) if (!names.has(other)) throw new Error(`room ${room.name} may import "${other}", which is not a room of the table`);
  }
  return rooms;
}

/** The room a repository path lies in (the longest folder that holds it). */
function roomOf(rooms, path) {
  let best;
  for (const room of rooms) {
    if ((path === room.folder || path.startsWith(`${room.folder}/`)) && (!best || room.folder.length > best.folder.length)) best = room;
  }
  return best;
}

/** The import specifiers of a source text, with their line numbers, as the TypeScript compiler reads them. */
export function importsOf(text) {
  const { importedFiles } = ts.preProcessFile(text, true, true);
  return importedFiles.map((f) => ({ specifier: f.fileName, line: text.slice(0, f.pos).split('\n').length }));
}

function packageAllowed(room, specifier) {
  return room.packages.some((p) => (p === 'node:' ? specifier.startsWith('node:') : specifier === p || specifier.startsWith(`${p}/`)));
}

/**
 * Violations in a set of source files (repository paths, '/'-separated, with their text): an
 * import of a room the importer's row does not list, of a package it does not list, of a file
 * in no room, or a source file that lies in no room.
 * @param {Room[]} rooms
 * @param {{ path: string; text: string }[]} files
 * @returns {Violation[]}
 */
export function checkImports(rooms, files) {
  /** @type {Violation[]} */
  const violations = [];
  for (const { path, text } of files) {
    const from = roomOf(rooms, path);
    if (!from) {
      violations.push({ file: path, line: 1, specifier: '', message: 'lies in no room of the table' });
      continue;
    }
    for (const { specifier, line } of importsOf(text)) {
      if (!specifier.startsWith('.')) {
        if (!packageAllowed(from, specifier)) violations.push({ file: path, line, specifier, message: `${from.name} may not import the package ${specifier}` });
        continue;
      }
      const target = posix.normalize(posix.join(posix.dirname(path), specifier));
      const to = roomOf(rooms, target);
      if (!to) violations.push({ file: path, line, specifier, message: `${from.name} imports ${target}, which lies in no room` });
      else if (to !== from && !from.rooms.includes(to.name)) violations.push({ file: path, line, specifier, message: `${from.name} may not import ${to.name}` });
    }
  }
  return violations;
}

/** Every TypeScript source file under the rooms' folders, as repository paths with their text. */
export function sourceFiles(root, rooms) {
  const files = [];
  const walk = (dir) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const full = join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.name.endsWith('.ts')) files.push({ path: relative(root, full).split(sep).join('/'), text: readFileSync(full, 'utf8') });
    }
  };
  // The top folders the rooms share (server/src, grammar/src, client/src), walked whole so a new folder in no room is seen.
  const tops = [...new Set(rooms.map((r) => r.folder.split('/').slice(0, 2).join('/')))];
  for (const top of tops) walk(join(root, top));
  return files;
}

/** The violations of the repository at `root`. */
export function checkRepository(root) {
  const rooms = readRooms(readFileSync(join(root, 'DEVELOPERS.md'), 'utf8'));
  return checkImports(rooms, sourceFiles(root, rooms));
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const root = join(fileURLToPath(new URL('.', import.meta.url)), '..');
  const violations = checkRepository(root);
  for (const v of violations) console.error(`${v.file}:${v.line}: ${v.message}${v.specifier ? ` ('${v.specifier}')` : ''}`);
  console.error(violations.length ? `${violations.length} import(s) the rooms table forbids` : 'every import is one the rooms table allows');
  process.exitCode = violations.length ? 1 : 0;
}
