import { Fragment, useState } from 'react';
import { Mail } from 'lucide-react';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import type { OutboxMessage } from '../api/get-outbox';

const URL_RE = /(https?:\/\/[^\s<>"]+)/g;

/** Plain text with every http(s) address made into a link a person can tap. */
function LinkedText({ text }: { text: string }) {
  const parts = text.split(URL_RE);
  return (
    <p className="whitespace-pre-wrap break-words text-sm leading-relaxed">
      {parts.map((part, i) =>
        i % 2 === 1 ? (
          <a key={i} href={part} className="inline-block min-h-tap break-all py-3 font-semibold text-moss underline dark:text-[#9cc3a8]">
            {part}
          </a>
        ) : (
          <Fragment key={i}>{part}</Fragment>
        ),
      )}
    </p>
  );
}

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });

function OutboxItem({ message }: { message: OutboxMessage }) {
  const [showHtml, setShowHtml] = useState(false);
  return (
    <Card className="flex flex-col gap-2">
      <div className="flex items-start gap-3">
        <Mail aria-hidden className="mt-1 h-5 w-5 shrink-0 text-moss" />
        <div className="min-w-0 flex-1">
          <h2 className="text-lg font-bold leading-snug">{message.subject || '(no subject)'}</h2>
          <p className="text-sm text-ink/70 dark:text-oat/70">
            To <span className="font-semibold break-all">{message.to}</span> · <time dateTime={message.date}>{when(message.date)}</time>
          </p>
        </div>
      </div>
      <LinkedText text={message.text} />
      {message.html ? (
        <>
          <Button variant="quiet" className="self-start" aria-expanded={showHtml} onClick={() => setShowHtml((v) => !v)}>
            {showHtml ? 'Hide the HTML version' : 'Show the HTML version'}
          </Button>
          {/* sandbox="" : the message cannot run scripts, submit forms or navigate this page. */}
          {showHtml ? <iframe title={`HTML version of "${message.subject}"`} sandbox="" srcDoc={message.html} className="h-[28rem] w-full rounded-soft border-2 border-wool bg-oat" /> : null}
        </>
      ) : null}
    </Card>
  );
}

/** Newest first: the one a person is waiting for is on top. */
export function OutboxList({ messages }: { messages: OutboxMessage[] }) {
  const newestFirst = [...messages].reverse();
  return (
    <ol className="flex flex-col gap-4" aria-label="Messages, newest first">
      {newestFirst.map((m, i) => (
        <li key={`${m.date}-${i}`}>
          <OutboxItem message={m} />
        </li>
      ))}
    </ol>
  );
}
