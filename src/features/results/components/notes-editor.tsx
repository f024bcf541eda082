import { useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { EditorContent, useEditor, useEditorState, type Editor } from '@tiptap/react';
import StarterKit from '@tiptap/starter-kit';
import { ALLOWED_MARKS, ALLOWED_NODES, HEADING_LEVELS, SAFE_HREF, type RichTextNode } from '@shared/rich-text';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/field';

const allowedTypes: readonly string[] = [...ALLOWED_NODES, ...ALLOWED_MARKS];

/** `{}` (keep, with defaults) when the shared allow-list has this type, `false` (leave out) when it hasn't. */
function ifAllowed(type: string): Record<string, never> | false {
  return allowedTypes.includes(type) ? {} : false;
}

/**
 * StarterKit cut down to the node and mark types of the shared allow-list, so the editor can
 * only produce what the server accepts: no code blocks, strike-through or underline.
 */
function extensions() {
  return [
    StarterKit.configure({
      blockquote: ifAllowed('blockquote'),
      bold: ifAllowed('bold'),
      bulletList: ifAllowed('bulletList'),
      code: ifAllowed('code'),
      codeBlock: ifAllowed('codeBlock'),
      hardBreak: ifAllowed('hardBreak'),
      horizontalRule: ifAllowed('horizontalRule'),
      italic: ifAllowed('italic'),
      listItem: ifAllowed('listItem'),
      orderedList: ifAllowed('orderedList'),
      strike: ifAllowed('strike'),
      underline: ifAllowed('underline'),
      heading: allowedTypes.includes('heading') ? { levels: [...HEADING_LEVELS] } : false,
      link: allowedTypes.includes('link')
        ? {
            openOnClick: false,
            autolink: true,
            linkOnPaste: true,
            defaultProtocol: 'https',
            protocols: ['mailto'],
            isAllowedUri: (url: string) => SAFE_HREF.test(url),
            HTMLAttributes: { rel: 'noopener noreferrer nofollow', target: null },
          }
        : false,
    }),
  ];
}

function ToolButton({
  pressed,
  onClick,
  children,
  disabled,
}: {
  pressed?: boolean;
  onClick: () => void;
  children: ReactNode;
  disabled?: boolean;
}) {
  return (
    <button
      type="button"
      aria-pressed={pressed}
      disabled={disabled}
      onMouseDown={(e) => e.preventDefault() /* keep the text selection in the editor */}
      onClick={onClick}
      className={`rounded border px-2 py-1 text-sm ${
        pressed ? 'border-accent bg-accent-soft font-semibold text-accent-strong' : 'border-transparent hover:border-rule hover:bg-paper'
      } disabled:opacity-50`}
    >
      {children}
    </button>
  );
}

function LinkForm({ editor, onDone }: { editor: Editor; onDone: () => void }) {
  const id = useId();
  const current = (editor.getAttributes('link').href as string | undefined) ?? '';
  const [href, setHref] = useState(current);
  const [error, setError] = useState<string | null>(null);
  const inputRef = useRef<HTMLInputElement>(null);

  const apply = () => {
    const url = href.trim();
    if (!SAFE_HREF.test(url)) {
      setError('Use a full address starting with http://, https:// or mailto:');
      inputRef.current?.focus();
      return;
    }
    const chain = editor.chain().focus();
    if (editor.state.selection.empty && !editor.isActive('link')) {
      // No text selected: the address itself becomes the link text.
      chain.insertContent({ type: 'text', text: url, marks: [{ type: 'link', attrs: { href: url } }] }).run();
    } else {
      chain.extendMarkRange('link').setLink({ href: url }).run();
    }
    onDone();
  };

  return (
    <div className="flex flex-col gap-1 border-b border-rule bg-paper px-3 py-2">
      <label htmlFor={id} className="text-sm font-medium">
        Link address
      </label>
      <div className="flex flex-wrap gap-2">
        <Input
          ref={inputRef}
          id={id}
          type="url"
          autoFocus
          className="min-w-0 flex-1"
          value={href}
          placeholder="https://…"
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          onChange={(e) => setHref(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === 'Enter') {
              e.preventDefault();
              apply();
            }
            if (e.key === 'Escape') {
              e.preventDefault();
              onDone();
              editor.commands.focus();
            }
          }}
        />
        <Button size="sm" onClick={apply}>
          Apply link
        </Button>
        {editor.isActive('link') ? (
          <Button
            size="sm"
            variant="secondary"
            onClick={() => {
              editor.chain().focus().extendMarkRange('link').unsetLink().run();
              onDone();
            }}
          >
            Remove link
          </Button>
        ) : null}
        <Button
          size="sm"
          variant="quiet"
          onClick={() => {
            onDone();
            editor.commands.focus();
          }}
        >
          Cancel
        </Button>
      </div>
      {error ? (
        <p id={`${id}-error`} className="text-sm text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
}

export interface NotesEditorProps {
  id: string;
  value: RichTextNode | null | undefined;
  /** Called with the document, or null when the editor is empty. */
  onChange: (doc: RichTextNode | null) => void;
  onBlur?: () => void;
  describedBy?: string;
  invalid?: boolean;
}

/**
 * The notes editor (TipTap): headings, lists, bold, italic and links, exactly the types the
 * server stores. Loaded as its own chunk, only on the new-result page.
 */
export default function NotesEditor({ id, value, onChange, onBlur, describedBy, invalid }: NotesEditorProps) {
  const [linking, setLinking] = useState(false);
  const attributes = {
    id,
    role: 'textbox',
    'aria-multiline': 'true',
    'aria-label': 'Notes',
    ...(describedBy ? { 'aria-describedby': describedBy } : {}),
    ...(invalid ? { 'aria-invalid': 'true' } : {}),
    class: 'rich-text',
  };
  const editor = useEditor({
    extensions: extensions(),
    content: value ?? '',
    editorProps: { attributes },
    onUpdate: ({ editor: e }) => onChange(e.isEmpty ? null : (e.getJSON() as RichTextNode)),
    onBlur: () => onBlur?.(),
  });

  // The error state changes after the editor exists; hand it the new attributes.
  useEffect(() => {
    editor.setOptions({ editorProps: { attributes } });
  }, [editor, invalid, describedBy]);

  const state = useEditorState({
    editor,
    selector: ({ editor: e }) => ({
      h2: e.isActive('heading', { level: 2 }),
      h3: e.isActive('heading', { level: 3 }),
      bullet: e.isActive('bulletList'),
      ordered: e.isActive('orderedList'),
      bold: e.isActive('bold'),
      italic: e.isActive('italic'),
      link: e.isActive('link'),
    }),
  });

  return (
    <div className={`notes-editor rounded-md border bg-panel ${invalid ? 'border-danger' : 'border-rule'}`}>
      <div role="toolbar" aria-label="Notes formatting" aria-controls={id} className="flex flex-wrap gap-1 border-b border-rule px-2 py-1.5">
        <ToolButton pressed={state.h2} onClick={() => editor.chain().focus().toggleHeading({ level: 2 }).run()}>
          Heading 2
        </ToolButton>
        <ToolButton pressed={state.h3} onClick={() => editor.chain().focus().toggleHeading({ level: 3 }).run()}>
          Heading 3
        </ToolButton>
        <span aria-hidden="true" className="mx-1 w-px self-stretch bg-rule" />
        <ToolButton pressed={state.bullet} onClick={() => editor.chain().focus().toggleBulletList().run()}>
          Bulleted list
        </ToolButton>
        <ToolButton pressed={state.ordered} onClick={() => editor.chain().focus().toggleOrderedList().run()}>
          Numbered list
        </ToolButton>
        <span aria-hidden="true" className="mx-1 w-px self-stretch bg-rule" />
        <ToolButton pressed={state.bold} onClick={() => editor.chain().focus().toggleBold().run()}>
          <strong>Bold</strong>
        </ToolButton>
        <ToolButton pressed={state.italic} onClick={() => editor.chain().focus().toggleItalic().run()}>
          <em>Italic</em>
        </ToolButton>
        <ToolButton pressed={state.link || linking} onClick={() => setLinking((v) => !v)}>
          Link
        </ToolButton>
      </div>
      {linking ? <LinkForm editor={editor} onDone={() => setLinking(false)} /> : null}
      <EditorContent editor={editor} />
    </div>
  );
}
