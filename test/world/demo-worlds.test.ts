import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { checkWorldFile, loadWorld } from '../../src/world/parse.js';

// The issue asks for at least three demo worlds differing in size (up to ~40×40) and in the
// number of emitters (1 to 6), each opening with a comment on what it is for.
const files = readdirSync('worlds').filter((f) => f.endsWith('.yaml')).map((f) => `worlds/${f}`);

describe('demo worlds', () => {
  it('ship at least three, including the default greenhouse', () => {
    expect(files.length).toBeGreaterThanOrEqual(3);
    expect(files).toContain('worlds/greenhouse.yaml');
  });

  it.each(files)('%s is valid, at most 40×40, with 1 to 6 emitters and a leading comment', (file) => {
    expect(checkWorldFile(file)).toEqual([]);
    const world = loadWorld(file);
    expect(world.width).toBeLessThanOrEqual(40);
    expect(world.height).toBeLessThanOrEqual(40);
    expect(world.emitters.length).toBeGreaterThanOrEqual(1);
    expect(world.emitters.length).toBeLessThanOrEqual(6);
    expect(readFileSync(file, 'utf8').startsWith('# ')).toBe(true);
  });

  it('differ in size and in the number of emitters', () => {
    const worlds = files.map(loadWorld);
    expect(new Set(worlds.map((w) => w.width * w.height)).size).toBe(worlds.length);
    expect(new Set(worlds.map((w) => w.emitters.length)).size).toBeGreaterThanOrEqual(3);
  });
});
