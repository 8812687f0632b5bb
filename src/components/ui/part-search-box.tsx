import { useEffect, useRef, type KeyboardEvent } from 'react';
import { ComboBox, Input, Label, ListBox, ListBoxItem, Popover, Text } from 'react-aria-components';
import type { PartSuggestion } from '../../../shared/schemas/parts';
import { SUGGEST_MIN_LENGTH, useSuggestions } from '../../lib/part-suggestions';

interface Props {
  id: string;
  label: string;
  /** Show the label to sighted users too (the pad's rows keep theirs for screen readers only). */
  labelHidden?: boolean;
  value: string;
  onChange: (value: string) => void;
  /** A suggestion was chosen (click, or arrow keys and Enter). */
  onPick: (suggestion: PartSuggestion) => void;
  /** Enter with no suggestion chosen. */
  onEnter?: () => void;
  placeholder?: string;
  maxLength?: number;
  inputClassName: string;
  describedBy?: string;
  invalid?: boolean;
  autoFocus?: boolean;
}

/**
 * A part-number field that suggests parts as it is typed: an ARIA combobox (react-aria-components) whose list comes
 * from /api/parts/suggest. Arrow keys move through the list, Enter takes the part shown, Escape closes the list;
 * Enter with nothing chosen is the caller's (search, or move on to the next field).
 */
export function PartSearchBox(props: Props) {
  const { data, isFetching, isError } = useSuggestions(props.value);
  const items = data?.items ?? [];
  const inputRef = useRef<HTMLInputElement>(null);
  // Arriving with focus (it took the place of a field being typed in): the caret goes after what was typed.
  useEffect(() => {
    const input = inputRef.current;
    if (props.autoFocus && input && document.activeElement === input) input.setSelectionRange(input.value.length, input.value.length);
    // Only as it arrives.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key !== 'Enter' || e.nativeEvent.isComposing) return;
    // An option is highlighted (virtual focus): the combobox takes it. Otherwise Enter is the caller's.
    if (inputRef.current?.getAttribute('aria-activedescendant')) return;
    e.preventDefault();
    props.onEnter?.();
  };
  return (
    <ComboBox
      aria-label={props.labelHidden ? props.label : undefined}
      inputValue={props.value}
      onInputChange={props.onChange}
      items={items}
      allowsCustomValue
      // The list opens as typing starts, before the first answer, which then fills it (with a word while waiting).
      allowsEmptyCollection
      menuTrigger="input"
      // Nothing stays selected: picking is an action, and picking the same part again must work.
      selectedKey={null}
      onSelectionChange={(key) => {
        const picked = items.find((s) => s.partNumber === key);
        if (picked) props.onPick(picked);
      }}
      className="relative w-full min-w-0"
    >
      {!props.labelHidden && <Label className="mb-1 block font-semibold">{props.label}</Label>}
      <Input
        ref={inputRef}
        id={props.id}
        placeholder={props.placeholder}
        maxLength={props.maxLength}
        spellCheck={false}
        autoFocus={props.autoFocus}
        aria-describedby={props.describedBy}
        aria-invalid={props.invalid || undefined}
        onKeyDown={onKeyDown}
        className={props.inputClassName}
      />
      <Popover placement="bottom start" offset={4} className="w-[min(36rem,calc(100vw-1rem))] rounded-md border border-cast-line bg-white shadow-lg outline-none">
        <ListBox<PartSuggestion>
          className="max-h-96 overflow-auto p-1 outline-none"
          renderEmptyState={() => (
            <p className="px-3 py-2 text-sm text-cast">
              {props.value.trim().length < SUGGEST_MIN_LENGTH ? 'Keep typing: a part number, cross-reference or words' : isError ? 'Suggestions could not be loaded; press Enter to search' : isFetching || !data ? 'Looking…' : 'No parts match; press Enter to search'}
            </p>
          )}
        >
          {(s) => (
            <ListBoxItem
              id={s.partNumber}
              textValue={s.partNumber}
              className="grid cursor-pointer gap-0.5 rounded px-3 py-2 text-ink outline-none data-[focused]:bg-temper-tint data-[focused]:text-temper-deep"
            >
              <span className="flex flex-wrap items-baseline gap-x-2">
                <span className="part-no font-semibold whitespace-nowrap">{s.partNumber}</span>
                {s.status === 'superseded' && s.supersededBy && <span className="text-sm text-amber">superseded by {s.supersededBy}</span>}
                {s.status === 'discontinued' && <span className="text-sm text-cast">discontinued</span>}
              </span>
              <span className="truncate text-sm">{s.title}</span>
              <Text slot="description" className="text-xs text-cast">
                {s.reason}
              </Text>
            </ListBoxItem>
          )}
        </ListBox>
        {data && data.total > items.length && (
          <p className="border-t border-cast-line px-3 py-2 text-xs text-cast">
            {items.length} of {data.total.toLocaleString('en-US')} matches
          </p>
        )}
      </Popover>
    </ComboBox>
  );
}
