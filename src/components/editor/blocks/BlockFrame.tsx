// The editor's frame around every guideline block: drag handle, name, move/copy/remove, live preview and settings.
import { NodeViewWrapper, type ReactNodeViewProps } from '@tiptap/react';
import { useId, useState, type ReactNode } from 'react';
import { blockDefinition } from '@/blocks';
import { BlockRenderer } from '@/blocks/renderers';
import { deleteBlock, duplicateBlock, moveBlock, topLevelIndex } from '@/components/editor/commands';
import { useIdentity } from '@/components/editor/IdentityContext';

function ToolButton({ label, onClick, children, danger }: { label: string; onClick: () => void; children: ReactNode; danger?: boolean }) {
  return (
    <button
      type="button"
      aria-label={label}
      title={label}
      onClick={onClick}
      className={`inline-flex h-7 min-w-7 items-center justify-center rounded px-1.5 text-sm text-ink-soft hover:bg-paper hover:text-ink ${danger ? 'hover:text-danger' : ''}`}
    >
      {children}
    </button>
  );
}

/** The shared frame; `settings` are the block's own controls, `preview` overrides the published rendering. */
export function BlockFrame({ props, settings, preview, startOpen }: { props: ReactNodeViewProps; settings: ReactNode; preview?: ReactNode; startOpen?: boolean }) {
  const identity = useIdentity();
  const { editor, node, getPos, selected } = props;
  const def = blockDefinition(node.type.name);
  const label = def?.label ?? node.type.name;
  const [open, setOpen] = useState(Boolean(startOpen));
  const panelId = useId();
  const index = () => {
    const pos = getPos();
    return typeof pos === 'number' ? topLevelIndex(editor, pos) : -1;
  };
  return (
    <NodeViewWrapper
      as="div"
      data-block-frame={node.type.name}
      id={typeof node.attrs.id === 'string' ? `block-${node.attrs.id}` : undefined}
      // Border and padding sit outside the column (-17px = 1px border + 16px padding), so the block renders at the published width.
      className={`-mx-[17px] my-4 rounded-xl border bg-card ${selected ? 'border-plumb ring-2 ring-plumb/25' : 'border-rule'}`}
    >
      <div contentEditable={false} className="flex items-center gap-2 border-b border-rule px-2 py-1 font-sans text-ink" role="toolbar" aria-label={`${label} block`}>
        <span data-drag-handle draggable="true" className="cursor-grab select-none px-1 text-ink-faint" title="Drag to reorder" aria-hidden="true">
          ⠿
        </span>
        <span className="eyebrow">{label}</span>
        <div className="ml-auto flex items-center gap-0.5">
          {settings ? (
            <button type="button" className="rounded px-2 py-1 text-xs font-semibold text-plumb hover:bg-plumb-wash" aria-expanded={open} aria-controls={panelId} onClick={() => setOpen((o) => !o)}>
              {open ? 'Close settings' : 'Settings'}
            </button>
          ) : null}
          <ToolButton label={`Move ${label} up`} onClick={() => moveBlock(editor, index(), -1)}>↑</ToolButton>
          <ToolButton label={`Move ${label} down`} onClick={() => moveBlock(editor, index(), 1)}>↓</ToolButton>
          <ToolButton label={`Duplicate ${label}`} onClick={() => duplicateBlock(editor, index())}><svg width="14" height="14" viewBox="0 0 14 14" aria-hidden="true" fill="none" stroke="currentColor" strokeWidth="1.4"><rect x="4.5" y="4.5" width="8" height="8" rx="1.5" /><path d="M9.5 2.5v-.5a1 1 0 0 0-1-1h-6a1 1 0 0 0-1 1v6a1 1 0 0 0 1 1h.5" /></svg></ToolButton>
          <ToolButton label={`Remove ${label}`} onClick={() => deleteBlock(editor, index())} danger>✕</ToolButton>
        </div>
      </div>
      <div contentEditable={false} className="p-4" data-block-preview>
        {preview ?? <BlockRenderer type={node.type.name} attrs={node.attrs} identity={identity} mode="site" editing />}
      </div>
      {open && settings ? (
        <div id={panelId} contentEditable={false} className="grid gap-4 border-t border-rule bg-paper/60 p-4 font-sans text-ink" role="group" aria-label={`${label} settings`}>
          {settings}
        </div>
      ) : null}
    </NodeViewWrapper>
  );
}
