// Stage scripts report one JSON object on stdout; "not available yet" is a result, not a crash.
export async function stageMain(fn) {
  try {
    process.stdout.write(JSON.stringify(await fn()) + '\n');
  } catch (e) {
    const msg = String(e?.message ?? e);
    process.stdout.write(JSON.stringify({ unavailable: msg.startsWith('not available yet'), error: msg.split('\n').slice(0, 3).join(' | ') }) + '\n');
  }
}

/** Wall seconds of an async call. */
export async function timed(fn) {
  const t0 = process.hrtime.bigint();
  const value = await fn();
  return { s: Number(process.hrtime.bigint() - t0) / 1e9, value };
}
