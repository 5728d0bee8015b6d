import { createHash } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import type { BackendWasm } from '@tensorflow/tfjs-backend-wasm';

const instances = new Map<string, WeakMap<WebAssembly.Memory, WebAssembly.Exports>>();

/**
 * The exports of the WebAssembly kernels written in src/learn/<name>.wat, instantiated on
 * `memory` (the wasm backend's heap, so they read and write tensors in place); one
 * instance per memory.
 *
 * The package build assembles the text to dist/wasm/<name>-<hash>.wasm, the hash taken over
 * the text: the text beside this module picks the binary, so one that is older than the
 * text is never run.
 */
export function wasmKernels(name: string, memory: WebAssembly.Memory): WebAssembly.Exports {
  const byMemory = instances.get(name) ?? new WeakMap<WebAssembly.Memory, WebAssembly.Exports>();
  instances.set(name, byMemory);
  let exports = byMemory.get(memory);
  if (exports == null) {
    exports = new WebAssembly.Instance(compiled(name), { tfjs: { memory } }).exports;
    byMemory.set(memory, exports);
  }
  return exports;
}

const modules = new Map<string, WebAssembly.Module>();

function compiled(name: string): WebAssembly.Module {
  let module = modules.get(name);
  if (module == null) {
    const hash = createHash('sha256').update(readFileSync(new URL(`./${name}.wat`, import.meta.url), 'utf8')).digest('hex').slice(0, 16);
    // src/learn/ and dist/learn/ both sit two folders below the package root.
    const binary = new URL(`../../dist/wasm/${name}-${hash}.wasm`, import.meta.url);
    if (!existsSync(binary)) throw new Error(`the WebAssembly kernels dist/wasm/${name}-${hash}.wasm are missing or older than src/learn/${name}.wat: run \`npm run build\``);
    module = new WebAssembly.Module(readFileSync(binary));
    modules.set(name, module);
  }
  return module;
}

/** The wasm backend's heap (tfjs-backend-wasm keeps its Emscripten module's exports on `wasm.asm`). */
export function wasmHeap(backend: BackendWasm): WebAssembly.Memory {
  const memory = (backend.wasm as unknown as { asm?: { memory?: unknown } }).asm?.memory;
  if (!(memory instanceof WebAssembly.Memory)) throw new Error('the tfjs wasm backend does not expose its memory');
  return memory;
}
