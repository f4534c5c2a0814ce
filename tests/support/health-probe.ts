import { spawn } from 'node:child_process';
import path from 'node:path';

/**
 * Asks `url` every `everyMs` from a child process (see health-probe-child.mjs) until `stop()`, which resolves
 * to the answer times in ms (Infinity for a failed ask; an ask never answered counts as long as it was waited for).
 */
export async function startHealthProbe(url: string, everyMs = 25, graceMs = 5000): Promise<{ stop(): Promise<number[]> }> {
  const child = spawn(process.execPath, [path.join(__dirname, 'health-probe-child.mjs')], {
    env: { ...process.env, PROBE_URL: url, EVERY_MS: String(everyMs), GRACE_MS: String(graceMs) },
    stdio: ['pipe', 'pipe', 'inherit'],
  });
  let out = '';
  child.stdout.setEncoding('utf8');
  await new Promise<void>((resolve, reject) => {
    child.once('error', reject);
    child.stdout.on('data', function ready(chunk: string) {
      out += chunk;
      if (out.includes('ready\n')) {
        out = out.slice(out.indexOf('ready\n') + 6);
        child.stdout.off('data', ready);
        resolve();
      }
    });
  });
  child.stdout.on('data', (chunk: string) => (out += chunk));
  return {
    stop: () =>
      new Promise<number[]>((resolve, reject) => {
        child.once('exit', () => {
          try {
            resolve((JSON.parse(out.trim()) as (number | null)[]).map((n) => (n === null ? Infinity : n)));
          } catch (e) {
            reject(new Error(`health probe printed no samples: ${out.slice(0, 200)} (${String(e)})`));
          }
        });
        child.stdin.end();
      }),
  };
}
