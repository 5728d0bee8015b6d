// ESLint rules that hold src/ to its module table (DEVELOPERS.md): each top-level folder
// (or file) of src/ is a module; a module imports only from modules above it in an
// ordered list, some pairs never import each other, some packages belong to one module,
// and no files import each other in a cycle.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import ts from 'typescript';

/** The module of a path under root: its first folder, or its file name without extension; null outside root. */
function moduleOf(path, root) {
  const rel = relative(root, path);
  if (rel === '' || rel.startsWith('..')) return null;
  const [first, ...rest] = rel.split(sep);
  return rest.length === 0 ? first.replace(/\.(ts|tsx|js)$/, '') : first;
}

/** Whether a package specifier matches a pattern such as 'ink', 'ink-*' or '@tensorflow/*'. */
function matchesPackage(specifier, pattern) {
  const regex = new RegExp(`^${pattern.split('*').map((part) => part.replace(/[.+?^${}()|[\]\\/]/g, '\\$&')).join('.*')}(/.*)?$`);
  return regex.test(specifier);
}

const tableOptions = {
  type: 'object',
  properties: {
    root: { type: 'string' },
    order: { type: 'array', items: { type: 'string' } },
    apart: { type: 'array', items: { type: 'array', items: { type: 'string' } } },
    packages: { type: 'array', items: { type: 'object', properties: { patterns: { type: 'array' }, modules: { type: 'array' }, message: { type: 'string' } } } },
  },
  required: ['root', 'order'],
  additionalProperties: false,
};

const moduleOrder = {
  meta: {
    type: 'problem',
    docs: { description: 'A module of src/ imports only from modules above it in the module table.' },
    schema: [tableOptions],
    messages: {
      unlisted: "src/{{module}} is not in the module table; add it to the ordered list in eslint.config.js and DEVELOPERS.md.",
      upward: '{{from}} may not import {{to}}: a module imports only from modules above it ({{above}}).',
      apart: '{{from}} and {{to}} never import each other.',
      package: '{{message}}',
    },
  },
  create(context) {
    const { root, order, apart = [], packages = [] } = context.options[0];
    const rootDir = resolve(context.cwd, root);
    const names = order.map((name) => name.replace(/\.ts$/, ''));
    const from = moduleOf(context.filename, rootDir);
    if (from == null) return {};
    const rank = names.indexOf(from);
    const label = (name) => order[names.indexOf(name)] ?? name;
    const check = (node, specifier) => {
      if (typeof specifier !== 'string') return;
      if (!specifier.startsWith('.')) {
        for (const { patterns, modules, message } of packages) {
          if (patterns.some((p) => matchesPackage(specifier, p)) && !modules.includes(from)) context.report({ node, messageId: 'package', data: { message } });
        }
        return;
      }
      const to = moduleOf(resolve(dirname(context.filename), specifier), rootDir);
      if (to == null || to === from || rank < 0) return;
      const data = { from: label(from), to: label(to), above: order.slice(0, rank).join(', ') || 'none' };
      if (names.indexOf(to) > rank || !names.includes(to)) context.report({ node, messageId: 'upward', data });
      else if (apart.some((pair) => pair.includes(from) && pair.includes(to))) context.report({ node, messageId: 'apart', data });
    };
    return {
      Program(node) {
        if (rank < 0) context.report({ node, messageId: 'unlisted', data: { module: from } });
      },
      ImportDeclaration: (node) => check(node, node.source.value),
      ExportNamedDeclaration: (node) => node.source != null && check(node, node.source.value),
      ExportAllDeclaration: (node) => check(node, node.source.value),
      ImportExpression: (node) => node.source.type === 'Literal' && check(node, node.source.value),
    };
  },
};

/** Source files under a folder. */
function sourceFiles(dir) {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(path);
    return /\.tsx?$/.test(entry.name) && !entry.name.endsWith('.d.ts') ? [path] : [];
  });
}

const parsed = new Map(); // path → { mtimeMs, imports }

/** The files a source file imports statically (type-only imports too when `types`), resolved to paths. */
function importsOf(path, types) {
  const mtimeMs = statSync(path).mtimeMs;
  let entry = parsed.get(path);
  if (entry == null || entry.mtimeMs !== mtimeMs) {
    const source = ts.createSourceFile(path, readFileSync(path, 'utf8'), ts.ScriptTarget.Latest, false);
    const imports = [];
    for (const statement of source.statements) {
      if (!(ts.isImportDeclaration(statement) || ts.isExportDeclaration(statement)) || statement.moduleSpecifier == null) continue;
      const specifier = statement.moduleSpecifier.text;
      if (!specifier.startsWith('.')) continue;
      const base = resolve(dirname(path), specifier).replace(/\.js$/, '');
      const target = [`${base}.ts`, `${base}.tsx`].find((candidate) => { try { return statSync(candidate).isFile(); } catch { return false; } });
      if (target != null) imports.push({ target, typeOnly: isTypeOnly(statement) });
    }
    entry = { mtimeMs, imports };
    parsed.set(path, entry);
  }
  return entry.imports.filter((i) => types || !i.typeOnly).map((i) => i.target);
}

function isTypeOnly(statement) {
  if (ts.isExportDeclaration(statement)) return statement.isTypeOnly;
  const clause = statement.importClause;
  if (clause == null) return false; // a side-effect import runs the module
  if (clause.isTypeOnly) return true;
  const bindings = clause.namedBindings;
  return clause.name == null && bindings != null && ts.isNamedImports(bindings) && bindings.elements.length > 0 && bindings.elements.every((e) => e.isTypeOnly);
}

/** Strongly connected components with more than one file, or a file importing itself (Tarjan 1972). */
function cycles(graph) {
  let next = 0;
  const index = new Map();
  const low = new Map();
  const stack = [];
  const onStack = new Set();
  const found = [];
  const visit = (v) => {
    index.set(v, next);
    low.set(v, next);
    next += 1;
    stack.push(v);
    onStack.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!index.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v), low.get(w)));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v), index.get(w)));
    }
    if (low.get(v) !== index.get(v)) return;
    const component = [];
    let w;
    do {
      w = stack.pop();
      onStack.delete(w);
      component.push(w);
    } while (w !== v);
    if (component.length > 1 || (graph.get(v) ?? []).includes(v)) found.push(new Set(component));
  };
  for (const v of graph.keys()) if (!index.has(v)) visit(v);
  return found;
}

/** A shortest import path from `start` back to `goal` inside one cycle. */
function pathBack(graph, component, start, goal) {
  const previous = new Map([[start, null]]);
  const queue = [start];
  while (queue.length > 0) {
    const v = queue.shift();
    if (v === goal) break;
    for (const w of graph.get(v) ?? []) {
      if (component.has(w) && !previous.has(w)) {
        previous.set(w, v);
        queue.push(w);
      }
    }
  }
  const path = [];
  for (let v = goal; v != null; v = previous.get(v)) path.unshift(v);
  return path;
}

const noImportCycle = {
  meta: {
    type: 'problem',
    docs: { description: 'No files of src/ import each other in a cycle.' },
    schema: [{ type: 'object', properties: { root: { type: 'string' }, types: { type: 'boolean' } }, required: ['root'], additionalProperties: false }],
    messages: { cycle: 'import cycle: {{path}}' },
  },
  create(context) {
    const { root, types = true } = context.options[0];
    const rootDir = resolve(context.cwd, root);
    const file = resolve(context.filename);
    if (moduleOf(file, rootDir) == null) return {};
    return {
      Program(program) {
        const graph = new Map(sourceFiles(rootDir).map((path) => [path, importsOf(path, types)]));
        const component = cycles(graph).find((c) => c.has(file));
        if (component == null) return;
        for (const statement of program.body) {
          const specifier = statement.source?.value;
          if (typeof specifier !== 'string' || !specifier.startsWith('.')) continue;
          const base = resolve(dirname(file), specifier).replace(/\.js$/, '');
          const target = [`${base}.ts`, `${base}.tsx`].find((candidate) => component.has(candidate) && graph.get(file).includes(candidate));
          if (target == null) continue;
          const path = [file, ...pathBack(graph, component, target, file)].map((p) => relative(context.cwd, p)).join(' → ');
          context.report({ node: statement, messageId: 'cycle', data: { path } });
        }
      },
    };
  },
};

/** The plugin: `crosswise/module-order` and `crosswise/no-import-cycle`. */
export default { meta: { name: 'crosswise-module-table' }, rules: { 'module-order': moduleOrder, 'no-import-cycle': noImportCycle } };
