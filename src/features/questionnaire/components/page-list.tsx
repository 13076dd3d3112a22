import { arrayMove, useSortable } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import { cn } from '@/lib/cn';
import { createSortableAnnouncements } from '@/lib/sortable-announcements';
import { VerticalSortable } from '@/components/ui/vertical-sortable';
import { pageKindLabels, type QuestionnairePage } from '@shared/schemas/questionnaire';
import { showIfOf } from '@shared/survey/skip-logic';
import { templateLabels } from '@shared/schemas/questionnaire-templates';

export function pageSummary(page: QuestionnairePage): string {
  if (page.kind === 'question' || page.kind === 'screening') return page.question.text;
  return page.title;
}

/** What kind of page it is, as the editor names it (a template's own name where it has one). */
export function pageKindName(page: QuestionnairePage): string {
  const template =
    page.kind === 'question' || page.kind === 'instructions' ? page.template : undefined;
  return template ? templateLabels[template] : pageKindLabels[page.kind];
}

/** Screen readers hear a moved page's title and its number in the list, not its internal id. */
export function pageAnnouncements(pages: QuestionnairePage[], movable: QuestionnairePage[]) {
  const byId = new Map(pages.map((p, i) => [p.id, { page: p, number: i + 1 }]));
  return createSortableAnnouncements(
    movable.map((p) => p.id),
    (id) => {
      const entry = byId.get(String(id));
      return entry ? `page “${pageSummary(entry.page)}”` : 'the page';
    },
    (id) => byId.get(String(id))?.number ?? 0,
    pages.length,
  );
}

/** Pages that must stay in place: the consent page first and the end page last. */
const pinned = (p: QuestionnairePage) => p.kind === 'consent' || p.kind === 'end';

type RowProps = {
  page: QuestionnairePage;
  index: number;
  selected: boolean;
  onSelect: () => void;
};

function RowBody({ page, index, onSelect, selected }: RowProps) {
  return (
    <button
      type="button"
      onClick={onSelect}
      aria-current={selected ? 'true' : undefined}
      className="min-w-0 flex-1 px-2 py-2 text-left"
    >
      <span className="block text-xs font-medium text-primary">
        <span className="num mr-1 inline-block w-5 text-left">{index + 1}</span>
        {pageKindName(page)}
        {showIfOf(page) && (
          <span className="ml-1 font-normal text-ink-soft">
            · if “{showIfOf(page)!.questionKey}” matches
          </span>
        )}
        {page.kind === 'screening' && page.quotaCells.length > 0 && (
          <span className="ml-1 font-normal text-ink-soft">· quotas</span>
        )}
      </span>
      <span className="block truncate text-sm text-ink">{pageSummary(page)}</span>
    </button>
  );
}

const rowClass = (selected: boolean) =>
  cn(
    'flex items-stretch rounded-md border bg-white',
    selected ? 'border-primary ring-2 ring-primary/20' : 'border-line',
  );

/** Consent and end pages (and every page while the study is frozen) do not move. */
function StaticRow(props: RowProps) {
  return (
    <li className={rowClass(props.selected)}>
      <span className="w-9 shrink-0" aria-hidden />
      <RowBody {...props} />
    </li>
  );
}

function SortableRow(props: RowProps) {
  const s = useSortable({ id: props.page.id });
  return (
    <li
      ref={s.setNodeRef}
      style={{ transform: CSS.Transform.toString(s.transform), transition: s.transition }}
      className={cn(rowClass(props.selected), s.isDragging && 'relative z-10 shadow-lg')}
    >
      <button
        type="button"
        {...s.attributes}
        {...s.listeners}
        aria-label={`Move page ${props.index + 1}: ${pageSummary(props.page)}`}
        className="flex w-9 shrink-0 cursor-grab touch-none items-center justify-center rounded-l-md text-ink-muted hover:bg-primary-soft hover:text-primary"
      >
        <svg viewBox="0 0 16 16" className="size-4" aria-hidden>
          <path
            d="M5 3h2v2H5zM9 3h2v2H9zM5 7h2v2H5zM9 7h2v2H9zM5 11h2v2H5zM9 11h2v2H9z"
            fill="currentColor"
          />
        </svg>
      </button>
      <RowBody {...props} />
    </li>
  );
}

/** The questionnaire's pages in order; drag by the handle, or focus it and use the arrow keys. */
export function PageList({
  pages,
  selectedId,
  onSelect,
  onReorder,
  disabled,
}: {
  pages: QuestionnairePage[];
  selectedId: string | null;
  onSelect: (id: string) => void;
  onReorder: (pages: QuestionnairePage[]) => void;
  disabled: boolean;
}) {
  const movable = pages.filter((p) => !pinned(p));
  const onMove = (from: number, to: number) => {
    const moved = arrayMove(movable, from, to);
    const first = pages.filter((p) => p.kind === 'consent');
    const last = pages.filter((p) => p.kind === 'end');
    onReorder([...first, ...moved, ...last]);
  };
  const announcements = pageAnnouncements(pages, movable);
  return (
    <VerticalSortable
      ids={movable.map((p) => p.id)}
      onMove={onMove}
      announcements={announcements}
      instructions="To move a page, press space or enter on its handle, use the up and down arrow keys, then press space or enter again. Escape cancels."
    >
      <ol aria-label="Questionnaire pages" className="space-y-2">
        {pages.map((p, i) => {
          const Row = pinned(p) || disabled ? StaticRow : SortableRow;
          return (
            <Row
              key={p.id}
              page={p}
              index={i}
              selected={p.id === selectedId}
              onSelect={() => onSelect(p.id)}
            />
          );
        })}
      </ol>
    </VerticalSortable>
  );
}
