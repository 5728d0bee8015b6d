import { useEffect } from 'react';

/**
 * Calls `beat` `perSecond` times a second of wall-clock time while `playing`: a timer
 * late on a busy machine makes up the beats it missed, so playback keeps its speed and
 * skips frames instead of slowing down. The timer stops when playing stops or on unmount.
 */
export function usePlayer(playing: boolean, perSecond: number, beat: () => void): void {
  useEffect(() => {
    if (!playing) return undefined;
    const periodMs = 1000 / perSecond;
    let last = performance.now();
    const timer = setInterval(() => {
      const due = Math.floor((performance.now() - last) / periodMs);
      for (let i = 0; i < due; i++) beat();
      last += due * periodMs;
    }, periodMs);
    return () => clearInterval(timer);
  }, [playing, perSecond, beat]);
}
