import type { ESLint } from 'eslint';

/** The plugin: `crosswise/module-order` and `crosswise/no-import-cycle`. */
declare const plugin: ESLint.Plugin;
export default plugin;
