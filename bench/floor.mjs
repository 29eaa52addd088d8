#!/usr/bin/env node
// The read-and-count floor: stream a file and count its newline (0x0A) bytes. Nothing the
// analysis does can be cheaper than reading every byte once, so the benchmark reports the
// analysis's wall time and memory as ratios against this process, measured in the same run.
//
//   node bench/floor.mjs FILE      → prints {"bytes": …, "newlines": …} on stdout
import { createReadStream } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** Count 0x0A bytes in one buffer with the native memchr-backed indexOf. */
export function countNewlines(buf) {
  let n = 0;
  for (let i = buf.indexOf(10); i !== -1; i = buf.indexOf(10, i + 1)) n++;
  return n;
}

/** Stream `path` in 1 MiB chunks; resolve to { bytes, newlines }. */
export async function readAndCount(path) {
  let bytes = 0;
  let newlines = 0;
  for await (const chunk of createReadStream(path, { highWaterMark: 1 << 20 })) {
    bytes += chunk.length;
    newlines += countNewlines(chunk);
  }
  return { bytes, newlines };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === resolve(process.argv[1])) {
  const path = process.argv[2];
  if (!path) {
    process.stderr.write('usage: node bench/floor.mjs FILE\n');
    process.exitCode = 2;
  } else {
    process.stdout.write(JSON.stringify(await readAndCount(path)) + '\n');
  }
}
