'use client';
import {
  Circle,
  Eraser,
  Hand,
  Highlighter,
  ImageUp,
  Keyboard,
  MapPin,
  MessageSquareDashed,
  PenLine,
  Redo2,
  Scissors,
  Square,
  Trash2,
  SquareDashedMousePointer,
  Undo2,
  ZoomIn,
  ZoomOut,
  Maximize,
} from 'lucide-react';
import { TONE_GREYS, type RoomShape, greyToCss } from '@/lib/strokes/types';
import { type Guides, type Tool, toolAllowed } from './tools';

export type { Tool };

export const TOOL_INFO: { tool: Tool; label: string; key: string; Icon: typeof PenLine }[] = [
  { tool: 'pen', label: 'Pen', key: '1', Icon: PenLine },
  { tool: 'tone', label: 'Tone marker', key: '2', Icon: Highlighter },
  { tool: 'eraser', label: 'Eraser', key: '3', Icon: Eraser },
  // A dashed selection with a pointer: choose strokes and move them (the loop of a lasso read as a speech balloon).
  { tool: 'lasso', label: 'Lasso', key: '4', Icon: SquareDashedMousePointer },
  // A dashed balloon: the room kept free for one.
  { tool: 'room', label: 'Balloon room', key: '5', Icon: MessageSquareDashed },
  { tool: 'pan', label: 'Pan the view', key: '6', Icon: Hand },
  { tool: 'pin', label: 'Pin a comment', key: '7', Icon: MapPin },
  { tool: 'lightbox', label: 'Arrange the lightbox', key: '8', Icon: ImageUp },
];

function IconButton({
  label,
  pressed,
  onClick,
  disabled,
  children,
}: {
  label: string;
  pressed?: boolean;
  onClick: () => void;
  disabled?: boolean;
  children: React.ReactNode;
}) {
  return (
    <button
      type="button"
      aria-label={label}
      title={label}
      aria-pressed={pressed}
      disabled={disabled}
      onClick={onClick}
      className={`inline-flex h-9 w-9 items-center justify-center rounded-md border text-sm ${pressed ? 'border-ink bg-ink text-white' : 'border-transparent text-graphite hover:bg-paper-deep'} disabled:opacity-40`}
    >
      {children}
    </button>
  );
}

export function EditorToolbar(p: {
  canDraw: boolean;
  canComment: boolean;
  tool: Tool;
  setTool: (t: Tool) => void;
  penSize: number;
  setPenSize: (n: number) => void;
  penSizes: number[];
  toneSize: number;
  setToneSize: (n: number) => void;
  toneSizes: number[];
  toneGrey: number;
  setToneGrey: (n: number) => void;
  roomShape: RoomShape;
  setRoomShape: (s: RoomShape) => void;
  penOnly: boolean;
  setPenOnly: (b: boolean) => void;
  eraserCuts: boolean;
  setEraserCuts: (b: boolean) => void;
  guides: Guides;
  setGuides: (g: Guides) => void;
  onUndo: () => void;
  onRedo: () => void;
  canUndo: boolean;
  canRedo: boolean;
  zoomIn: () => void;
  zoomOut: () => void;
  fit: () => void;
  openHelp: () => void;
}) {
  const tools = TOOL_INFO.filter((t) => toolAllowed(t.tool, { draw: p.canDraw, comment: p.canComment }));
  return (
    <div
      className="panel flex shrink-0 flex-row flex-nowrap items-center gap-3 overflow-x-auto p-2 lg:w-48 lg:flex-col lg:items-start lg:overflow-y-auto lg:overflow-x-hidden [&>*]:shrink-0"
      role="toolbar"
      aria-label="Sketch tools"
    >
      <div className="flex flex-wrap gap-1" role="group" aria-label="Tool">
        {tools.map(({ tool, label, key, Icon }) => (
          <IconButton key={tool} label={`${label} (${key})`} pressed={p.tool === tool} onClick={() => p.setTool(tool)}>
            <Icon aria-hidden className="h-5 w-5" />
          </IconButton>
        ))}
      </div>
      {p.canDraw && (
        <div className="flex gap-1" role="group" aria-label="History">
          <IconButton label="Undo (Ctrl+Z)" onClick={p.onUndo} disabled={!p.canUndo}>
            <Undo2 aria-hidden className="h-5 w-5" />
          </IconButton>
          <IconButton label="Redo (Ctrl+Shift+Z)" onClick={p.onRedo} disabled={!p.canRedo}>
            <Redo2 aria-hidden className="h-5 w-5" />
          </IconButton>
        </div>
      )}
      {p.canDraw && p.tool === 'pen' && (
        <label className="block text-xs font-bold text-graphite-soft">
          Pen width
          <select className="field mt-1 py-1 text-sm" value={p.penSize} onChange={(e) => p.setPenSize(Number(e.target.value))}>
            {p.penSizes.map((s) => (
              <option key={s} value={s}>
                {s} mm
              </option>
            ))}
          </select>
        </label>
      )}
      {p.canDraw && p.tool === 'tone' && (
        <div className="space-y-2">
          <fieldset>
            <legend className="text-xs font-bold text-graphite-soft">Tone grey</legend>
            <div className="mt-1 flex gap-1">
              {TONE_GREYS.map((g) => (
                <button
                  key={g}
                  type="button"
                  aria-label={`${g}% grey`}
                  aria-pressed={p.toneGrey === g}
                  onClick={() => p.setToneGrey(g)}
                  className={`h-8 w-8 rounded border-2 text-[10px] font-bold ${p.toneGrey === g ? 'border-ink' : 'border-paper-edge'}`}
                  style={{ background: greyToCss(g), color: g >= 60 ? '#fff' : '#2a2a2d' }}
                >
                  {g}
                </button>
              ))}
            </div>
          </fieldset>
          <label className="block text-xs font-bold text-graphite-soft">
            Marker width
            <select className="field mt-1 py-1 text-sm" value={p.toneSize} onChange={(e) => p.setToneSize(Number(e.target.value))}>
              {p.toneSizes.map((s) => (
                <option key={s} value={s}>
                  {s} mm
                </option>
              ))}
            </select>
          </label>
        </div>
      )}
      {p.canDraw && p.tool === 'eraser' && (
        <div className="flex gap-1" role="group" aria-label="Eraser">
          <IconButton label="Take whole strokes" pressed={!p.eraserCuts} onClick={() => p.setEraserCuts(false)}>
            <Trash2 aria-hidden className="h-5 w-5" />
          </IconButton>
          <IconButton label="Cut strokes where it passes" pressed={p.eraserCuts} onClick={() => p.setEraserCuts(true)}>
            <Scissors aria-hidden className="h-5 w-5" />
          </IconButton>
        </div>
      )}
      {p.canDraw && p.tool === 'room' && (
        <div className="flex gap-1" role="group" aria-label="Room shape">
          <IconButton label="Oval room" pressed={p.roomShape === 'ellipse'} onClick={() => p.setRoomShape('ellipse')}>
            <Circle aria-hidden className="h-5 w-5" />
          </IconButton>
          <IconButton label="Box room" pressed={p.roomShape === 'rect'} onClick={() => p.setRoomShape('rect')}>
            <Square aria-hidden className="h-5 w-5" />
          </IconButton>
        </div>
      )}
      <div className="flex gap-1" role="group" aria-label="Zoom">
        <IconButton label="Zoom in (+)" onClick={p.zoomIn}>
          <ZoomIn aria-hidden className="h-5 w-5" />
        </IconButton>
        <IconButton label="Zoom out (−)" onClick={p.zoomOut}>
          <ZoomOut aria-hidden className="h-5 w-5" />
        </IconButton>
        <IconButton label="Fit the page (0)" onClick={p.fit}>
          <Maximize aria-hidden className="h-5 w-5" />
        </IconButton>
      </div>
      <fieldset className="whitespace-nowrap text-xs">
        <legend className="font-bold text-graphite-soft">Guides</legend>
        {(['bleed', 'trim', 'safe', 'panels'] as const).map((g) => (
          <label key={g} className="mr-2 inline-flex items-center gap-1 lg:flex">
            <input type="checkbox" checked={p.guides[g]} onChange={(e) => p.setGuides({ ...p.guides, [g]: e.target.checked })} />
            {g === 'safe' ? 'Safe area' : g === 'panels' ? 'Panels' : g === 'trim' ? 'Trim' : 'Bleed'}
          </label>
        ))}
      </fieldset>
      {p.canDraw && (
        <label className="inline-flex items-center gap-1 whitespace-nowrap text-xs">
          <input type="checkbox" checked={p.penOnly} onChange={(e) => p.setPenOnly(e.target.checked)} />
          Pen only (ignore touch) (P)
        </label>
      )}
      <button
        type="button"
        onClick={p.openHelp}
        className="inline-flex items-center gap-1 whitespace-nowrap rounded px-1 text-xs font-bold text-ink hover:underline"
      >
        <Keyboard aria-hidden className="h-4 w-4" /> Shortcuts (?)
      </button>
    </div>
  );
}
