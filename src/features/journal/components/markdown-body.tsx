import Markdown, { type Components } from 'react-markdown';

// Entries are Markdown written by the maker. No raw HTML ever renders (skipHtml drops it), images are not
// loaded from anywhere (photos belong in the photo area), and links open away from Whorlbook.
const components: Components = {
  p: ({ children }) => <p className="mb-2 last:mb-0">{children}</p>,
  ul: ({ children }) => <ul className="mb-2 list-disc pl-5 last:mb-0">{children}</ul>,
  ol: ({ children }) => <ol className="mb-2 list-decimal pl-5 last:mb-0">{children}</ol>,
  strong: ({ children }) => <strong className="font-bold">{children}</strong>,
  a: ({ href, children }) => (
    <a href={href} target="_blank" rel="noopener noreferrer nofollow" className="font-semibold text-moss underline dark:text-[#9cc3a8]">
      {children}
    </a>
  ),
  h1: ({ children }) => <p className="mb-1 text-lg font-bold">{children}</p>,
  h2: ({ children }) => <p className="mb-1 text-lg font-bold">{children}</p>,
  h3: ({ children }) => <p className="mb-1 font-bold">{children}</p>,
  h4: ({ children }) => <p className="mb-1 font-bold">{children}</p>,
  blockquote: ({ children }) => <blockquote className="mb-2 border-l-4 border-wool pl-3 italic">{children}</blockquote>,
  code: ({ children }) => <code className="rounded bg-wool px-1 font-sans font-semibold text-sm dark:bg-[#3a3430]">{children}</code>,
};

export function MarkdownBody({ text }: { text: string }) {
  return (
    <div className="leading-relaxed break-words">
      <Markdown skipHtml disallowedElements={['img']} unwrapDisallowed components={components}>
        {text}
      </Markdown>
    </div>
  );
}
