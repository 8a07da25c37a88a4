import { CASE_REF_PATTERN, type CaseReference } from '../../../shared/cases/case-references';

// The few mdast fields this plugin touches; the full types belong to packages we do not pin.
interface MdNode {
  type: string;
  value?: string;
  url?: string;
  title?: string | null;
  children?: MdNode[];
  data?: { hProperties?: Record<string, unknown> };
}

/** Text under these is never a case link: code, links (URLs included), raw HTML, math. */
const SKIP = new Set(['link', 'linkReference', 'definition', 'code', 'inlineCode', 'html', 'math', 'inlineMath']);

function splitText(value: string, titles: Map<number, string>): MdNode[] | null {
  const out: MdNode[] = [];
  let last = 0;
  for (const m of value.matchAll(CASE_REF_PATTERN)) {
    const id = Number(m[1]);
    const title = titles.get(id);
    // a case the reader may not open is left exactly as written
    if (title === undefined) continue;
    if (m.index > last) out.push({ type: 'text', value: value.slice(last, m.index) });
    out.push({ type: 'link', url: `/cases/${id}`, title, children: [{ type: 'text', value: m[0] }], data: { hProperties: { dataCaseRef: id } } });
    last = m.index + m[0].length;
  }
  if (out.length === 0) return null;
  if (last < value.length) out.push({ type: 'text', value: value.slice(last) });
  return out;
}

function walk(node: MdNode, titles: Map<number, string>) {
  if (!node.children || SKIP.has(node.type)) return;
  node.children = node.children.flatMap((child) => {
    if (child.type === 'text' && child.value) return splitText(child.value, titles) ?? [child];
    walk(child, titles);
    return [child];
  });
}

/**
 * remark plugin: `#123` becomes a link to case 123 with its title on hover, but only for the
 * cases in `references`, the list the server made with the visibility policy. Any other number
 * stays plain text, so the page says nothing about cases the reader may not open.
 */
export function remarkCaseLinks(options: { references?: CaseReference[] } = {}) {
  const titles = new Map((options.references ?? []).map((r) => [r.id, r.title]));
  return (tree: MdNode) => {
    if (titles.size > 0) walk(tree, titles);
  };
}
