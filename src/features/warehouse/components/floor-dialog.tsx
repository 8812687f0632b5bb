import type { ReactNode } from 'react';
import { Dialog, Heading, Modal, ModalOverlay } from 'react-aria-components';

/** A modal for a decision that cannot be taken back; Escape or a click outside closes it, focus returns to where it was. */
export function FloorDialog({ title, isOpen, onClose, children }: { title: string; isOpen: boolean; onClose: () => void; children: ReactNode }) {
  return (
    <ModalOverlay isOpen={isOpen} onOpenChange={(open) => !open && onClose()} isDismissable className="fixed inset-0 z-50 flex items-center justify-center bg-ink/50 p-4">
      <Modal className="w-full max-w-lg rounded-lg border-2 border-cast bg-white shadow-xl">
        <Dialog className="grid gap-4 p-6 outline-none">
          <Heading slot="title" className="text-2xl font-bold">
            {title}
          </Heading>
          {children}
        </Dialog>
      </Modal>
    </ModalOverlay>
  );
}
