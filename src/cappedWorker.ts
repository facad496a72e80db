// The thread that runs a command under `--memory-limit`, with its heap capped (src/runCapped.ts starts
// it): the command's output and its exit code go back to the main thread as messages, and a signal
// the main thread received comes in as one, to stop as the executable does (src/bin.ts).
import { parentPort, workerData } from 'node:worker_threads';
import { EXIT, interruptedLine, run, type StopSignal } from './cli.js';
import { removeOpenTemps } from './files/openTemps.js';
import type { CappedMessage, CappedSetup } from './runCapped.js';

const port = parentPort;
if (port === null) throw new Error('cappedWorker runs as a worker thread only');
const setup = workerData as CappedSetup;
const send = (message: CappedMessage) => port.postMessage(message);

let stopping = false;
port.on('message', (m: { stop?: StopSignal }) => {
  if (m.stop === undefined || stopping) return;
  stopping = true;
  // As in bin.ts: locks and staged folders are on the same list; outputs already put in place are named as written.
  const { destinations, failed, written } = removeOpenTemps();
  const clear = setup.stderrTTY ? '\r\x1b[K' : ''; // over a progress line, if one is drawn
  send({ stderr: clear + interruptedLine(m.stop, destinations, failed.map((f) => `${f.path} (${f.reason})`), written) });
  send({ exit: m.stop === 'SIGINT' ? EXIT.interrupted : EXIT.terminated });
  process.exit();
});
// Listening must not keep the thread alive once the command is done.
port.unref();

const code = await run(setup.argv, {
  stdout: { write: (text: string) => send({ stdout: text }), isTTY: setup.stdoutTTY },
  stderr: { write: (text: string) => send({ stderr: text }), isTTY: setup.stderrTTY },
  env: process.env,
});
if (!stopping) send({ exit: code });
