/**
 * How the build cuts the code into files, for a crew lead's phone. Left to itself the bundler
 * splits the modules a page needs by which pages share them: Today came as some 55 files of
 * 1–25 kB each, and over HTTP/1.1 (six connections, 150 ms a round trip on a slow mobile
 * connection) waiting for them cost more than their bytes. Here:
 *
 * - the entry's own modules stay in the entry file (every page loads it anyway);
 * - the portal's modules that Today and its frame import, with everything they import in
 *   turn, are one file, `today`; the pages that share a module with it (a button, the query
 *   client) take it from there;
 * - every other page is split as the bundler sees fit.
 *
 * Today's dialogs (forms, inputs, validation: most of its code, none of its first screen) are
 * imported lazily by the page itself, so they are not part of `today`.
 *
 * The build also writes `today.html`, index.html naming Today's files besides the entry's, which
 * the API sends for `/today` (apps/api/src/http/portal.ts): the phone asks for them with the
 * entry instead of after running it, one download and a few hundred ms of a slow CPU sooner.
 */
import type { Plugin } from 'vite';

interface ModuleGraph {
  getModuleInfo(id: string): { importedIds: readonly string[] } | null;
}

/** The modules reachable from `roots` by static imports, not counting `skip`. */
function closure(graph: ModuleGraph, roots: string[], skip: Set<string> = new Set()): Set<string> {
  const seen = new Set<string>();
  const stack = [...roots];
  while (stack.length) {
    const id = stack.pop()!;
    if (seen.has(id) || skip.has(id)) continue;
    const info = graph.getModuleInfo(id);
    if (!info) continue;
    seen.add(id);
    stack.push(...info.importedIds);
  }
  return seen;
}

/**
 * `srcDir` is the portal's source folder, `entry` its entry module and `roots` the modules of
 * Today and its frame. Returns a plugin (resetting the graph a watch rebuild changes) and the
 * groups for `output.codeSplitting.groups`.
 */
export function todayChunks(srcDir: string, entry: string, roots: string[]) {
  let today: Set<string> | null = null;
  const plugin: Plugin = {
    name: 'swardwise:today-chunks',
    apply: 'build',
    // After Vite has written index.html into the bundle.
    enforce: 'post',
    buildStart() {
      today = null;
    },
    generateBundle(_options, bundle) {
      const index = bundle['index.html'];
      const page = Object.values(bundle).find((c) => c.type === 'chunk' && c.name === 'today');
      if (index?.type !== 'asset' || page?.type !== 'chunk') return;
      const html = String(index.source);
      const scripts = new Set<string>();
      const styles = new Set<string>();
      const visit = (fileName: string) => {
        const chunk = bundle[fileName];
        if (chunk?.type !== 'chunk' || scripts.has(fileName)) return;
        scripts.add(fileName);
        for (const css of chunk.viteMetadata?.importedCss ?? []) styles.add(css);
        for (const imported of chunk.imports) visit(imported);
      };
      visit(page.fileName);
      const links = [
        ...[...scripts].filter((f) => !html.includes(`/${f}"`)).map((f) => `<link rel="modulepreload" crossorigin href="/${f}">`),
        // A stylesheet already in the page is one the lazy import does not add again.
        ...[...styles].filter((f) => !html.includes(`/${f}"`)).map((f) => `<link rel="stylesheet" crossorigin href="/${f}">`),
      ];
      this.emitFile({ type: 'asset', fileName: 'today.html', source: html.replace('</head>', `  ${links.join('\n    ')}\n  </head>`) });
    },
  };
  /**
   * Only the portal's own modules are named here: a static walk goes through barrel files
   * (`element-plus/es`, the domain package's index) to every module they re-export, used or
   * not. What those modules really import is added by the bundler
   * (`includeDependenciesRecursively`, on by default).
   */
  const name = (id: string, graph: ModuleGraph): string | null => {
    today ??= closure(graph, roots, closure(graph, [entry]));
    return id.startsWith(srcDir) && today.has(id) ? 'today' : null;
  };
  const groups = [
    // Without this the `today` group would take the entry's modules it imports (Vue itself)
    // and every page, the sign-in included, would wait for Today's file. Named modules of
    // the entry's static graph merge back into the entry file.
    { name: 'app', tags: ['$initial' as const], priority: 2 },
    { name, priority: 1 },
  ];
  return { plugin, groups };
}
