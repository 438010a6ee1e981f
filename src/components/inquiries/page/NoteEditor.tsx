/**
 * Add a note to the inquiry. Typing `@` offers the firm's teammates in a list (arrow keys move,
 * Enter or Tab picks, Escape closes); each teammate named in the note is e-mailed a link to it.
 */
import { useId, useRef, useState } from 'react';
import '~/lib/shared/zod-in-browser';
import { mentionedIn, mentionQueryAt, type Mentionable } from '~/lib/shared/mentions';
import { NOTE_MAX, noteSchema } from '~/lib/shared/inquiry-work-schemas';
import { announceLeadChanged, sendJson, asRequestFailed, type FormStatus } from './api';
import { StatusLine } from './StatusLine';

/** At most this many names in the list at once. common practice, no source. */
const MAX_OFFERED = 6;

export function NoteEditor({ leadId, teammates }: { leadId: string; teammates: Mentionable[] }) {
  const id = useId();
  const listId = `${id}-mentions`;
  const field = useRef<HTMLTextAreaElement>(null);
  const [text, setText] = useState('');
  const [caret, setCaret] = useState(0);
  const [active, setActive] = useState(0);
  const [dismissedAt, setDismissedAt] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [status, setStatus] = useState<FormStatus>(null);
  const [busy, setBusy] = useState(false);

  const mention = mentionQueryAt(text, caret);
  const offered =
    mention && mention.start !== dismissedAt
      ? teammates.filter((t) => t.name.toLocaleLowerCase().includes(mention.query.toLocaleLowerCase())).slice(0, MAX_OFFERED)
      : [];
  const open = offered.length > 0;
  const activeIndex = Math.min(active, offered.length - 1);

  function pick(person: Mentionable) {
    if (!mention) return;
    const before = text.slice(0, mention.start);
    const after = text.slice(caret);
    const inserted = `@${person.name} `;
    const next = before + inserted + after;
    const at = before.length + inserted.length;
    setText(next);
    setCaret(at);
    setActive(0);
    requestAnimationFrame(() => {
      field.current?.focus();
      field.current?.setSelectionRange(at, at);
    });
  }

  function onKeyDown(event: React.KeyboardEvent<HTMLTextAreaElement>) {
    if (!open) return;
    if (event.key === 'ArrowDown' || event.key === 'ArrowUp') {
      event.preventDefault();
      const step = event.key === 'ArrowDown' ? 1 : -1;
      setActive((activeIndex + step + offered.length) % offered.length);
    } else if (event.key === 'Enter' || event.key === 'Tab') {
      event.preventDefault();
      pick(offered[activeIndex]!);
    } else if (event.key === 'Escape') {
      event.preventDefault();
      setDismissedAt(mention!.start);
    }
  }

  async function submit(event: React.SyntheticEvent<HTMLFormElement>) {
    event.preventDefault();
    setStatus(null);
    const parsed = noteSchema.safeParse({ text });
    if (!parsed.success) {
      setError(parsed.error.issues[0]!.message);
      return;
    }
    setError(null);
    setBusy(true);
    try {
      const answer = await sendJson<{ mailed: number }>('POST', `/api/app/leads/${leadId}/notes`, parsed.data);
      const named = mentionedIn(parsed.data.text, teammates).map((t) => t.name);
      setStatus({ kind: 'done', text: answer.mailed && named.length ? `Note added. ${named.join(', ')} will get an e-mail.` : 'Note added.' });
      setText('');
      setCaret(0);
      announceLeadChanged(leadId);
    } catch (failure) {
      const problem = asRequestFailed(failure);
      setError(problem.fields.text ?? null);
      setStatus({ kind: 'failed', text: problem.message });
    } finally {
      setBusy(false);
    }
  }

  const track = (el: HTMLTextAreaElement) => setCaret(el.selectionStart ?? el.value.length);

  return (
    <form onSubmit={submit} noValidate aria-labelledby={`${id}-h`} className="space-y-3">
      <h3 id={`${id}-h`} className="font-bold">
        Add a note
      </h3>
      <div className="relative">
        <label htmlFor={`${id}-text`} className="field-label">
          Note
        </label>
        <textarea
          ref={field}
          id={`${id}-text`}
          className="field-input"
          rows={3}
          maxLength={NOTE_MAX}
          value={text}
          role="combobox"
          aria-autocomplete="list"
          aria-expanded={open}
          aria-controls={listId}
          aria-activedescendant={open ? `${listId}-${activeIndex}` : undefined}
          aria-invalid={error ? true : undefined}
          aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`}
          onChange={(e) => {
            setText(e.target.value);
            track(e.target);
            setActive(0);
          }}
          onSelect={(e) => track(e.currentTarget)}
          onKeyDown={onKeyDown}
        />
        <ul
          id={listId}
          role="listbox"
          aria-label="Teammates to mention"
          hidden={!open}
          className="absolute z-10 mt-1 max-h-56 w-72 overflow-auto rounded-md border border-slate/40 bg-white py-1 text-sm shadow"
        >
          {offered.map((person, index) => (
            <li
              key={person.userId}
              id={`${listId}-${index}`}
              role="option"
              aria-selected={index === activeIndex}
              className={index === activeIndex ? 'cursor-pointer bg-sawdust px-3 py-1.5' : 'cursor-pointer px-3 py-1.5'}
              // mousedown, so the textarea keeps its caret and focus
              onMouseDown={(e) => {
                e.preventDefault();
                pick(person);
              }}
            >
              {person.name}
            </li>
          ))}
        </ul>
        <p id={`${id}-hint`} className="mt-1 text-xs text-slate">
          Type @ to mention a teammate; they get an e-mail with a link to this inquiry.
        </p>
        {error && (
          <p id={`${id}-error`} className="field-error">
            {error}
          </p>
        )}
      </div>
      <div className="flex items-center gap-3">
        <button type="submit" className="button-primary" disabled={busy}>
          Add note
        </button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
