'use client';

import * as Dialog from '@radix-ui/react-dialog';
import { useRef, useState, type ReactNode } from 'react';
import { buttonClass } from './button';

type Props = {
  /** The button that opens the dialog, e.g. "Remove from team". */
  triggerLabel: string;
  /** The trigger's accessible name when the visible label is too short alone; must contain it. */
  triggerAriaLabel?: string;
  triggerVariant?: 'danger' | 'secondary';
  title: string;
  /** What will happen, in the words the person will recognise afterwards. */
  description: ReactNode;
  /** Names the action and its object: "Remove Dana Whitlock", never "OK". */
  confirmLabel: string;
  /** Runs once per confirmation; the server action behind it still checks everything itself. */
  onConfirm: () => void;
  /** The safe choice, "Cancel" unless that word is in the action ("Keep the reminder"). */
  cancelLabel?: string;
  disabled?: boolean;
};

/**
 * Asks before a destructive action. Focus moves to Cancel (the safe choice) when it opens, Escape
 * or a click outside cancels, and the confirming button is the only red one on screen.
 */
export function ConfirmDialog({
  triggerLabel,
  triggerAriaLabel,
  triggerVariant = 'danger',
  title,
  description,
  confirmLabel,
  onConfirm,
  cancelLabel = 'Cancel',
  disabled,
}: Props) {
  const [open, setOpen] = useState(false);
  const cancelRef = useRef<HTMLButtonElement>(null);
  return (
    <Dialog.Root open={open} onOpenChange={setOpen}>
      <Dialog.Trigger
        type="button"
        disabled={disabled}
        aria-label={triggerAriaLabel}
        className={buttonClass(triggerVariant)}
      >
        {triggerLabel}
      </Dialog.Trigger>
      <Dialog.Portal>
        <Dialog.Overlay className="bg-ink/60 fixed inset-0 z-40" />
        <Dialog.Content
          role="alertdialog"
          onOpenAutoFocus={(e) => {
            e.preventDefault();
            cancelRef.current?.focus();
          }}
          className="border-ink bg-paper text-ink fixed top-1/2 left-1/2 z-50 flex w-[min(28rem,calc(100vw-2rem))] -translate-x-1/2 -translate-y-1/2 flex-col gap-4 rounded-lg border-2 p-5 shadow-lg"
        >
          <Dialog.Title className="text-xl font-bold">{title}</Dialog.Title>
          <Dialog.Description className="text-base">{description}</Dialog.Description>
          <div className="flex flex-wrap justify-end gap-3">
            <Dialog.Close ref={cancelRef} className={buttonClass('secondary')}>
              {cancelLabel}
            </Dialog.Close>
            <button
              type="button"
              className={buttonClass('danger')}
              onClick={() => {
                setOpen(false);
                onConfirm();
              }}
            >
              {confirmLabel}
            </button>
          </div>
        </Dialog.Content>
      </Dialog.Portal>
    </Dialog.Root>
  );
}
