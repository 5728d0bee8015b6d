// Installs one file-system fault in a crosswise process started by a test, from the
// environment: CROSSWISE_FAULT=<fs call>:<errno code>:<path part>[:<times>] makes the call
// fail for paths containing the part, the first <times> matching calls (every one when
// left out). Imported by run-with-fake.ts before the command runs; worker threads never
// load it, so only the main thread, which stores every cell, sees the fault.
import { ERRNO, injectFault } from './fs-faults.js';

const spec = process.env.CROSSWISE_FAULT;
if (spec != null && spec !== '') {
  const [call, code, part, times] = spec.split(':');
  if (!(code in ERRNO)) throw new Error(`CROSSWISE_FAULT: unknown errno code '${code}'`);
  let left = times == null ? Infinity : Number(times);
  injectFault(call as Parameters<typeof injectFault>[0], code as keyof typeof ERRNO, (path) => {
    if (!path.includes(part) || left <= 0) return false;
    left--;
    return true;
  });
}
