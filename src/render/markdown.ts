// notes.md → safe HTML. GitHub-flavoured Markdown, then sanitised: no script, no event handlers,
// no style, and no element that would load a remote resource (images and embeds are dropped;
// links stay as text a reader can follow).
import { unified } from 'unified';
import remarkParse from 'remark-parse';
import remarkGfm from 'remark-gfm';
import remarkRehype from 'remark-rehype';
import rehypeSanitize, { defaultSchema } from 'rehype-sanitize';
import rehypeStringify from 'rehype-stringify';

const schema = {
  ...defaultSchema,
  tagNames: (defaultSchema.tagNames ?? []).filter((t) => !['img', 'picture', 'source', 'video', 'audio', 'iframe'].includes(t)),
  protocols: { ...defaultSchema.protocols, src: [] },
};

const processor = unified()
  .use(remarkParse)
  .use(remarkGfm)
  .use(remarkRehype)
  .use(rehypeSanitize, schema)
  .use(rehypeStringify);

export function markdownToHtml(markdown: string): string {
  return String(processor.processSync(markdown));
}
