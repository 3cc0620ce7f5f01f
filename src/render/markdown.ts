// notes.md → safe HTML. GitHub-flavoured Markdown, then sanitised: no script, no event handlers,
// no style, and no element that would load a remote resource (images and embeds are dropped;
// links stay as text a reader can follow). Headings can be moved down a level or more, so the
// notes' own headings sit under the pack's "Notes" heading (and in its PDF outline).
import { unified } from 'unified';
import remarkParse from 'remark-parse';
import remarkGfm from 'remark-gfm';
import remarkRehype from 'remark-rehype';
import rehypeSanitize, { defaultSchema } from 'rehype-sanitize';
import rehypeStringify from 'rehype-stringify';
import { boundedCache } from './memo.js';
import { plainNotesHtml } from './markdown-plain.js';

const schema = {
  ...defaultSchema,
  tagNames: (defaultSchema.tagNames ?? []).filter((t) => !['img', 'picture', 'source', 'video', 'audio', 'iframe'].includes(t)),
  protocols: { ...defaultSchema.protocols, src: [] },
};

interface MdNode { type: string; depth?: number; children?: MdNode[] }

/** remark plugin: the shallowest heading becomes `topLevel`, the others keep their distance below it. */
function shiftHeadings(options: { topLevel?: number } = {}) {
  return (tree: MdNode) => {
    const headings: MdNode[] = [];
    const walk = (n: MdNode) => {
      if (n.type === 'heading') headings.push(n);
      n.children?.forEach(walk);
    };
    walk(tree);
    if (!options.topLevel || headings.length === 0) return;
    const shift = options.topLevel - Math.min(...headings.map((h) => h.depth ?? 1));
    for (const h of headings) h.depth = Math.max(1, Math.min(6, (h.depth ?? 1) + shift));
  };
}

const processors = new Map<number, ReturnType<typeof makeProcessor>>();

function makeProcessor(topLevel: number) {
  return unified()
    .use(remarkParse)
    .use(remarkGfm)
    .use(shiftHeadings, { topLevel })
    .use(remarkRehype)
    .use(rehypeSanitize, schema)
    .use(rehypeStringify);
}

/** The HTML of notes by their level and text: a job's notes are rendered again on every build and every save while served. */
const rendered = boundedCache<string>(128);

/** The full pipeline, for any notes. */
export function pipelineHtml(markdown: string, level: number): string {
  let p = processors.get(level);
  if (!p) {
    p = makeProcessor(level);
    processors.set(level, p);
  }
  return String(p.processSync(markdown));
}

/** `topLevel` 0 keeps the headings as written. Notes of only headings and plain paragraphs skip the pipeline (markdown-plain.ts). */
export function markdownToHtml(markdown: string, opts: { topLevel?: number } = {}): string {
  const level = opts.topLevel ?? 0;
  return plainNotesHtml(markdown, level) ?? rendered(`${level}\n${markdown}`, () => pipelineHtml(markdown, level));
}
