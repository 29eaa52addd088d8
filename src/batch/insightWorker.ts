/**
 * Worker-thread entry of the insight lane (insightLane.ts): computes the optional analysis of
 * each measurement it is sent and posts it back. Its only imports are this and insights.ts, so
 * it starts in a fraction of a pool worker's time. Compiled to dist/batch/insightWorker.js.
 */
import { parentPort } from 'node:worker_threads';
import { computeInsights, type InsightRequest } from './insights.js';

parentPort?.on('message', (msg: { id: number; request: InsightRequest }) => {
  try {
    parentPort?.postMessage({ id: msg.id, ok: true, insights: computeInsights(msg.request) });
  } catch (e) {
    parentPort?.postMessage({ id: msg.id, ok: false, message: e instanceof Error ? e.message : String(e) });
  }
});
