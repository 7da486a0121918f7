import { Plus } from 'lucide-react';
import { Button } from '@/components/button';
import { DraftErrors, DraftInput, EditorContext, type EditorState } from './part-editor';

/** The entry row under the parts table: type a line, Enter adds it and the row is ready for the next. */
export function PartEntryRow({ state, busy }: { state: EditorState; busy: boolean }) {
  const errors = state.row.errors;
  return (
    <EditorContext.Provider value={state}>
      <tr className="h-9 border-t-2 border-graphite-150 bg-copper-50/40">
        <td className="px-1.5 text-center text-copper-600">
          <Plus className="mx-auto size-4" aria-hidden />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="designators" placeholder="R1, R2" />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="category" />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="description" placeholder="What it is" />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="marking" mono placeholder="472" />
        </td>
        <td className="px-1.5 py-1 text-right text-xs text-graphite-600">auto</td>
        <td className="px-1.5 py-1">
          <DraftInput field="makerPartNumber" mono />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="package" placeholder="0402" />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="quantity" numeric />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="mount" />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="notes" />
        </td>
        <td className="sticky right-0 bg-copper-50 px-1.5 py-1 text-right">
          <Button size="sm" variant="primary" className="h-7" onClick={() => void state.row.submit()} busy={busy}>
            Add
          </Button>
        </td>
      </tr>
      <tr>
        <td colSpan={12} className="px-3 pb-2 pt-1">
          <div className="sticky left-3 w-fit max-w-[40rem]">
            {Object.keys(errors).length ? (
              <DraftErrors errors={errors} />
            ) : (
              <p className="text-xs text-graphite-500">Type a line and press Enter: it is added and this row is ready for the next. Esc clears it.</p>
            )}
          </div>
        </td>
      </tr>
    </EditorContext.Provider>
  );
}
