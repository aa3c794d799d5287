/**
 * What the service worker stores at install: the app shell and the pages a crew lead opens
 * with no signal (Today and its frame), worked out from the build's own chunk graph, so the
 * map, charts and tables (a few hundred kB a crew lead may never open) are not fetched on a
 * phone's mobile data. Other pages' chunks are kept as they are visited (vite.config.ts).
 */
import type { Plugin } from 'vite';

interface ManifestEntry {
  url: string;
  revision: string | null;
  size: number;
}

/** The plugin that reads the chunk graph, and the workbox manifest transform that uses it. */
export function offlineShell(pages: RegExp): { plugin: Plugin; manifestTransform: (entries: ManifestEntry[]) => Promise<{ manifest: ManifestEntry[] }> } {
  const keep = new Set<string>();
  const plugin: Plugin = {
    name: 'swardwise:offline-shell',
    apply: 'build',
    generateBundle(_options, bundle) {
      keep.clear();
      const visit = (fileName: string) => {
        const chunk = bundle[fileName];
        if (!chunk || keep.has(fileName)) return;
        keep.add(fileName);
        if (chunk.type !== 'chunk') return;
        for (const css of chunk.viteMetadata?.importedCss ?? []) keep.add(css);
        for (const asset of chunk.viteMetadata?.importedAssets ?? []) keep.add(asset);
        // What the page cannot run without; the entry's lazy imports are the other pages.
        for (const imported of chunk.imports) visit(imported);
        // A page's own lazy parts (Today's dialogs, fetched after its first screen) are
        // needed with no signal too.
        if (!chunk.isEntry && chunk.moduleIds.some((id) => pages.test(id))) for (const imported of chunk.dynamicImports) visit(imported);
      };
      for (const chunk of Object.values(bundle)) {
        // By the modules a file holds: a page may share its file with others (build/todayChunks.ts).
        if (chunk.type === 'chunk' && (chunk.isEntry || chunk.moduleIds.some((id) => pages.test(id)))) visit(chunk.fileName);
      }
    },
  };
  const manifestTransform = async (entries: ManifestEntry[]) => ({
    // index.html and the public files (the icon) are the shell itself; fonts are named by the
    // stylesheets, not by the chunks.
    manifest: entries.filter((e) => !e.url.startsWith('assets/') || e.url.endsWith('.woff2') || keep.has(e.url)),
  });
  return { plugin, manifestTransform };
}
