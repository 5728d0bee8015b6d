/** File-system calls that only ever write; `open` counts as a write only for errors no read gives. */
const WRITE_CALLS = new Set(['mkdir', 'rename', 'write', 'copyfile', 'chmod', 'unlink', 'rmdir', 'symlink', 'link']);
const WRITE_ONLY_CODES = new Set(['EROFS', 'ENOSPC', 'EDQUOT', 'EISDIR', 'EEXIST']);

/**
 * `cannot write <path>: <CODE>: <what the OS said> (<call>)` when the error is a failed
 * write to the file system, else null.
 */
export function writeFailure(error: unknown): string | null {
  const { syscall, code, path, message } = error as Partial<NodeJS.ErrnoException>;
  if (!(error instanceof Error) || syscall == null || code == null) return null;
  const writing = WRITE_CALLS.has(syscall) || (syscall === 'open' && WRITE_ONLY_CODES.has(code));
  if (!writing) return null;
  // Node's message is `<CODE>: <strerror text>, <call> '<path>'`.
  const said = message?.match(/^[A-Z]+: ([^,]+),/)?.[1];
  return `cannot write ${path ?? 'a file'}: ${code}${said == null ? '' : `: ${said}`} (${syscall})`;
}
