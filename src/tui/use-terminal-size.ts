import { useStdout } from 'ink';
import { useEffect, useState } from 'react';

/** The size the screen is laid out for when the output stream does not report one. */
const FALLBACK = { columns: 80, rows: 24 } as const;

function sizeOf(stdout: NodeJS.WriteStream): { columns: number; rows: number } {
  return { columns: stdout.columns > 0 ? stdout.columns : FALLBACK.columns, rows: stdout.rows > 0 ? stdout.rows : FALLBACK.rows };
}

/** The output terminal's columns and rows, updated when the terminal is resized. */
export function useTerminalSize(): { readonly columns: number; readonly rows: number } {
  const { stdout } = useStdout();
  const [size, setSize] = useState(() => sizeOf(stdout));
  useEffect(() => {
    const resized = () => setSize(sizeOf(stdout));
    stdout.on('resize', resized);
    return () => { stdout.off('resize', resized); };
  }, [stdout]);
  return size;
}
