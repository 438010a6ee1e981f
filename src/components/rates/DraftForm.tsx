import { useEffect, useState } from 'react';
import { FormProvider, useForm, type FieldErrors } from 'react-hook-form';
import type { RateBookInput } from '~/lib/estimate';
import { fieldAt, listAt, RATE_BOOK_GROUPS, RATE_BOOK_SECTIONS, type GroupId } from '~/lib/shared/rate-book-fields';
import { displayMessage, nestFieldMessages, rateBookResolver, toFormValues, type RateBookFormValues } from '~/lib/shared/rate-book-form';
import { formatInZone } from '~/lib/shared/time';
import { asRequestFailed, type FormStatus } from '~/components/inquiries/page/api';
import { StatusLine } from '~/components/inquiries/page/StatusLine';
import { ConflictNotice } from './ConflictNotice';
import { DraftConflict, saveDraft, type RateDraft } from './draft-api';
import { pathOfProblem, problemsOf, type Problem } from './error-summary';
import { inputIdOf, RateField } from './RateField';
import { RateList } from './RateList';

type Props = { draft: RateDraft; timeZone: string };

/**
 * The draft's numbers, group by group, checked by the core's schema as the owner types and saved
 * with the revision they were loaded at, so two owners never overwrite each other unknowingly.
 */
export function DraftForm({ draft, timeZone }: Props) {
  const [revision, setRevision] = useState(draft.revision);
  const [status, setStatus] = useState<FormStatus>(null);
  const [problems, setProblems] = useState<Problem[]>([]);
  const [conflict, setConflict] = useState<DraftConflict | null>(null);
  const [ready, setReady] = useState(false);
  const form = useForm<RateBookFormValues, unknown, RateBookInput>({
    resolver: rateBookResolver,
    defaultValues: toFormValues(draft.data),
    mode: 'onSubmit',
    reValidateMode: 'onChange',
  });
  const { handleSubmit, formState, setError, reset, getValues, watch } = form;
  const currency = /^[A-Z]{3}$/.test(watch('currency') ?? '') ? (watch('currency') as string) : draft.data.currency;
  const locale = (watch('locale') as string | undefined) || 'en-US';

  // Tests and people typing at once both wait for this: before it, a keystroke could be lost to hydration.
  useEffect(() => setReady(true), []);

  useEffect(() => {
    if (!formState.isDirty) return;
    // The browser asks "Leave site?" in its own words; a page's text is no longer shown.
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [formState.isDirty]);

  const refused = (errors: FieldErrors) => {
    setProblems(problemsOf(errors));
    setStatus({ kind: 'failed', text: 'Not saved: some fields need a look (listed below).' });
  };

  const save = handleSubmit(async (data) => {
    setStatus(null);
    setProblems([]);
    try {
      const saved = await saveDraft(revision, data);
      setRevision(saved.revision);
      reset(getValues());
      setStatus({
        kind: 'done',
        text: `Draft saved at ${formatInZone(saved.updatedAt, timeZone, 'dateTime')}. Estimates keep using the published version until you publish.`,
      });
    } catch (error) {
      if (error instanceof DraftConflict) {
        setConflict(error);
        setStatus({ kind: 'failed', text: 'Not saved: someone else saved this draft first.' });
        return;
      }
      const failed = asRequestFailed(error);
      const messages = Object.fromEntries(
        Object.entries(failed.fields).map(([path, message]) => [path, displayMessage(path, message, undefined, currency, locale)]),
      );
      for (const [path, message] of Object.entries(messages)) setError(listAt(path) ? `${path}.root` : path, { type: 'server', message });
      setProblems(problemsOf(nestFieldMessages(messages)));
      setStatus({ kind: 'failed', text: failed.message });
    }
  }, refused);

  const loadTheirs = () => {
    if (!conflict) return;
    reset(toFormValues(conflict.draft.data));
    setRevision(conflict.draft.revision);
    setConflict(null);
    setProblems([]);
    setStatus({ kind: 'done', text: 'Their version is loaded.' });
  };
  const keepMine = () => {
    if (!conflict) return;
    setRevision(conflict.draft.revision);
    setConflict(null);
    setStatus({ kind: 'done', text: 'Your changes are still here. Saving now replaces their version.' });
  };

  return (
    <FormProvider {...form}>
      <form onSubmit={save} noValidate className="mt-4" data-ready={ready ? 'true' : undefined} aria-label="Rate book draft">
        <nav aria-label="Rate book groups" className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
          {RATE_BOOK_GROUPS.map((g) => (
            <a key={g.id} href={`#group-${g.id}`}>
              {g.title}
            </a>
          ))}
        </nav>

        {RATE_BOOK_GROUPS.map((group) => (
          <Group key={group.id} id={group.id} title={group.title} help={group.help} currency={currency} />
        ))}

        <div className="sticky bottom-0 mt-6 space-y-3 border-t border-slate/30 bg-paper py-3">
          {conflict && (
            <ConflictNotice conflict={conflict} timeZone={timeZone} currency={currency} locale={locale} onLoadTheirs={loadTheirs} onKeepMine={keepMine} />
          )}
          <div className="flex flex-wrap items-center gap-3">
            <button type="submit" className="button-primary" disabled={formState.isSubmitting || conflict !== null}>
              {formState.isSubmitting ? 'Saving…' : 'Save draft'}
            </button>
            {formState.isDirty && !status && <span className="text-sm text-slate">Unsaved changes</span>}
            <StatusLine status={status} />
          </div>
          {problems.length > 0 && (
            <ul aria-label="Fields that need a look" className="max-h-40 overflow-y-auto text-sm">
              {problems.map((p) => (
                <li key={p.path}>
                  <a className="underline" href={`#${inputIdOf(pathOfProblem(p.path))}`}>
                    {p.where}
                  </a>
                  : <span className="text-brick">{p.message}</span>
                </li>
              ))}
            </ul>
          )}
        </div>
      </form>
    </FormProvider>
  );
}

function Group({ id, title, help, currency }: { id: GroupId; title: string; help: string; currency: string }) {
  return (
    <section id={`group-${id}`} aria-labelledby={`group-${id}-title`} className="mt-8">
      <h2 id={`group-${id}-title`} className="text-lg font-bold">
        {title}
      </h2>
      <p className="text-sm text-slate">{help}</p>
      {RATE_BOOK_SECTIONS.filter((s) => s.group === id).map((section) => (
        <fieldset key={section.id} className="mt-4">
          <legend className="text-base font-medium">{section.title}</legend>
          {section.help && <p className="text-xs text-slate">{section.help}</p>}
          <div className="mt-2 grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            {section.entries.map((entry) => {
              const list = listAt(entry);
              if (list) return <RateList key={entry} list={list} name={entry} currency={currency} heading={section.entries.length > 1} />;
              const field = fieldAt(entry)!;
              return <RateField key={entry} field={field} name={entry} currency={currency} />;
            })}
          </div>
        </fieldset>
      ))}
    </section>
  );
}
