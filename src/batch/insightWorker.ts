/**
 * Worker-thread entry of the insight lane (insightLane.ts): computes the optional analysis of
 * each measurement it is sent and posts it back, then, when asked, the measurement's beams packed
 * for viewer.html (src/report/viewerPack.ts, loaded on first use). Its only static imports are
 * this and insights.ts, so it starts in a fraction of a pool worker's time.
 * Compiled to dist/batch/insightWorker.js.
 */
import { parentPort } from 'node:worker_threads';
import { computeInsights, type InsightRequest } from './insights.js';

parentPort?.on('message', (msg: { id: number; request: InsightRequest; pack?: boolean }) => {
  try {
    parentPort?.postMessage({ id: msg.id, ok: true, insights: computeInsights(msg.request) });
  } catch (e) {
    parentPort?.postMessage({ id: msg.id, ok: false, message: e instanceof Error ? e.message : String(e) });
  }
  // Then the beams packed for viewer.html, while the main thread draws the unit's PDF; the
  // packer (node:zlib) loads on the first such request only.
  if (msg.pack) {
    import('../report/viewerPack.js')
      .then(({ packBeams }) => packBeams(msg.request.grid, msg.request.beams))
      .then((pack) => parentPort?.postMessage({ id: msg.id, pack }), () => parentPort?.postMessage({ id: msg.id, pack: null }));
  }
});
