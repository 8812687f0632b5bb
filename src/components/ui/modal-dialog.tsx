import type { ReactNode } from 'react';
import { Dialog, Heading, Modal, ModalOverlay } from 'react-aria-components';

/**
 * A modal asking to confirm something that is hard to take back (a short pick, applying a price list). Escape or a
 * click outside closes it and focus returns to where it was; a tall body scrolls inside it.
 */
export function ModalDialog({ title, isOpen, onClose, children }: { title: string; isOpen: boolean; onClose: () => void; children: ReactNode }) {
  return (
    <ModalOverlay isOpen={isOpen} onOpenChange={(open) => !open && onClose()} isDismissable className="fixed inset-0 z-50 flex items-center justify-center bg-ink/50 p-4">
      <Modal className="max-h-[90vh] w-full max-w-lg overflow-auto rounded-lg border-2 border-cast bg-white shadow-xl">
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
