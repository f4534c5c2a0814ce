'use client';
// A comment box that offers the series' members after "@": a listbox the box controls
// (aria-activedescendant), picked with the arrows and Enter or Tab, or with the mouse; Escape closes
// it. Under the box, what the mentions written so far match — nobody, several — before sending.
import { useId, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { type MentionMember, findMentions, mentionFor, mentionOptions, mentionQueryAt, mentionWarning } from '@/lib/review/mentions';

export function MentionField({
  id: fieldId,
  value,
  onChange,
  members,
  meId,
  label,
  rows = 3,
  placeholder,
  className = 'field mt-1',
}: {
  /** The box's id, for a <label htmlFor> beside it. */
  id?: string;
  value: string;
  onChange: (v: string) => void;
  /** The series' members (null while they load: no picker, no warning yet). */
  members: MentionMember[] | null;
  meId: string;
  /** The accessible name, when no <label> wraps the field. */
  label?: string;
  rows?: number;
  placeholder?: string;
  className?: string;
}) {
  const id = useId();
  const listId = `${id}-members`;
  const ref = useRef<HTMLTextAreaElement>(null);
  const [caret, setCaret] = useState<number | null>(null);
  const [active, setActive] = useState(0);
  const [closedAt, setClosedAt] = useState<number | null>(null);
  const others = useMemo(() => (members ?? []).filter((m) => m.userId !== meId), [members, meId]);
  const typing = caret !== null ? mentionQueryAt(value, caret) : null;
  const options = typing && members && closedAt !== typing.start ? mentionOptions(typing.query, others).slice(0, 8) : [];
  const open = options.length > 0;
  const current = Math.min(active, Math.max(0, options.length - 1));
  // Not while the list is open: a half-typed "@Ne" is not a mistake yet.
  const warning = members && !open ? mentionWarning(findMentions(value, members)) : null;

  const placeCaret = useRef<{ text: string; at: number } | null>(null);
  const track = () => setCaret(ref.current?.selectionStart ?? null);
  const pick = (m: MentionMember) => {
    if (!typing || !members) return;
    const text = `${mentionFor(m, members)} `;
    const end = caret ?? typing.start;
    const next = value.slice(0, typing.start) + text + value.slice(end).replace(/^ /, '');
    onChange(next);
    const at = typing.start + text.length;
    setActive(0);
    setCaret(at);
    placeCaret.current = { text: next, at };
  };

  // The caret goes after the picked name as the new text is committed, before the next key is
  // handled: placed a frame later, it would jump back over a letter typed in between.
  useLayoutEffect(() => {
    const want = placeCaret.current;
    const box = ref.current;
    if (!want || !box || box.value !== want.text) return;
    placeCaret.current = null;
    box.focus();
    box.setSelectionRange(want.at, want.at);
  }, [value]);

  return (
    <div className="relative">
      <textarea
        ref={ref}
        id={fieldId}
        className={className}
        rows={rows}
        value={value}
        placeholder={placeholder}
        aria-label={label}
        aria-autocomplete="list"
        aria-controls={open ? listId : undefined}
        aria-activedescendant={open ? `${listId}-${current}` : undefined}
        aria-describedby={`${id}-how${warning ? ` ${id}-warning` : ''}`}
        onChange={(e) => {
          onChange(e.target.value);
          setCaret(e.target.selectionStart);
          setActive(0);
          if (closedAt !== null && !mentionQueryAt(e.target.value, e.target.selectionStart)) setClosedAt(null);
        }}
        onSelect={track}
        onClick={track}
        onBlur={() => setCaret(null)}
        onKeyDown={(e) => {
          if (!open) return;
          if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
            e.preventDefault();
            setActive((current + (e.key === 'ArrowDown' ? 1 : options.length - 1)) % options.length);
          } else if (e.key === 'Enter' || e.key === 'Tab') {
            e.preventDefault();
            pick(options[current]!);
          } else if (e.key === 'Escape') {
            e.preventDefault();
            e.stopPropagation();
            setClosedAt(typing!.start);
          }
        }}
      />
      <span id={`${id}-how`} className="sr-only">
        Type @ and a name to mention a member: arrows choose, Enter picks, Escape closes the list.
      </span>
      {open && (
        <ul
          id={listId}
          role="listbox"
          aria-label="Members to mention"
          className="absolute left-0 z-20 mt-1 max-h-56 w-72 overflow-y-auto rounded-md border border-paper-edge bg-white py-1 text-sm shadow-card"
        >
          {options.map((m, i) => (
            <li
              key={m.userId}
              id={`${listId}-${i}`}
              role="option"
              aria-selected={i === current}
              className={`cursor-pointer px-3 py-1.5 ${i === current ? 'bg-ink text-white' : 'text-graphite hover:bg-paper-deep'}`}
              // Keep the focus (and the caret) in the box while the mouse picks.
              onMouseDown={(e) => e.preventDefault()}
              onMouseEnter={() => setActive(i)}
              onClick={() => pick(m)}
            >
              <span className="font-bold">{m.name}</span>{' '}
              <span className={i === current ? 'text-white/80' : 'text-graphite-faint'}>{mentionFor(m, members!)}</span>
            </li>
          ))}
        </ul>
      )}
      <p aria-live="polite" className="sr-only">
        {open ? `${options.length} member${options.length === 1 ? '' : 's'} to mention.` : ''}
      </p>
      {warning && (
        <p id={`${id}-warning`} className="mt-1 text-xs font-bold text-stamp" data-testid="mention-warning">
          {warning}
        </p>
      )}
    </div>
  );
}
