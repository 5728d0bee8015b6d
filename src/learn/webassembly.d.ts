// The slice of the WebAssembly JavaScript API (W3C WebAssembly JS API, 2.0) that crosswise
// uses: Node 20 provides it, but neither @types/node 20 nor TypeScript's ES libraries
// declare it (only lib.dom does, which a Node program should not load).
declare namespace WebAssembly {
  type ExportValue = (...args: number[]) => number | void;
  type Exports = Record<string, ExportValue | Memory>;
  type Imports = Record<string, Record<string, Memory | ExportValue>>;
  class Memory {
    readonly buffer: ArrayBuffer;
  }
  class Module {
    constructor(bytes: Uint8Array);
  }
  class Instance {
    constructor(module: Module, imports?: Imports);
    readonly exports: Exports;
  }
}
