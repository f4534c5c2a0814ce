// Asks `URL` every `EVERY_MS` ms (an open loop: a slow answer does not delay the next ask) from a process of its
// own, so the waits it records are the server's and not those of a test process busy driving the load.
// On SIGTERM (or stdin closing) it waits up to GRACE_MS for answers still owed, counts the unanswered as
// long as they were waited for, prints the samples (ms) as one JSON line and exits.
import http from 'node:http';

const url = new URL(process.env.PROBE_URL);
const every = Number(process.env.EVERY_MS ?? 25);
const grace = Number(process.env.GRACE_MS ?? 5000);
const samples = [];
const owed = new Set();
// One fresh connection per ask, like a monitor would open; no agent queueing in this process.
const agent = new http.Agent({ keepAlive: false, maxSockets: Infinity });

function ask() {
  const started = performance.now();
  const entry = { started };
  owed.add(entry);
  const req = http.get(url, { agent }, (res) => {
    res.resume();
    res.on('end', () => {
      owed.delete(entry);
      samples.push(res.statusCode === 200 ? performance.now() - started : Infinity);
    });
  });
  req.on('error', () => {
    owed.delete(entry);
    samples.push(Infinity);
  });
}

const timer = setInterval(ask, every);
let stopping = false;
async function stop() {
  if (stopping) return;
  stopping = true;
  clearInterval(timer);
  const until = performance.now() + grace;
  while (owed.size && performance.now() < until) await new Promise((r) => setTimeout(r, 20));
  for (const e of owed) samples.push(performance.now() - e.started);
  process.stdout.write(JSON.stringify(samples) + '\n', () => process.exit(0));
}
process.on('SIGTERM', stop);
process.stdin.on('end', stop);
process.stdin.resume();
process.stdout.write('ready\n');
