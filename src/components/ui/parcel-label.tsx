import type { ReactNode } from 'react';
import { formatDate } from '../../../shared/format';

/** Where parcels to the distributor go: its address, and the desk that opens them. */
export const OUR_ADDRESS = { name: 'Spoolyard Turbo Supply', address: 'Unit 7, Foundry Row, Quenchfold' } as const;

interface ParcelLabelProps {
  /** The word across the top, in capitals: what the parcel is ("RETURN", "SERVICE"). */
  heading: string;
  /** How the label is named to assistive technology ("Return" label RT-5001). */
  what: string;
  /** What the barcode's reference numbers, for its alternative text ("return", "service request"). */
  barcodeOf: string;
  reference: string;
  createdAt: string;
  /** The desk at our address that takes the parcel in. */
  desk: string;
  from: { name: string; line1: string; city: string; postcode: string };
  /** The Code 128 of the reference as an SVG document (drawn on the server by bwip-js). */
  barcodeSvg: string;
  /** What is in the parcel: `dt`/`dd` pairs. */
  children: ReactNode;
  className?: string;
}

/**
 * A parcel label the customer prints and cuts out, 100 mm wide: our address, theirs, the reference's barcode (shown
 * as an image so it prints sharp at any size) and what is inside. Return and service labels are both this.
 */
export function ParcelLabel({ heading, what, barcodeOf, reference, createdAt, desk, from, barcodeSvg, children, className = '' }: ParcelLabelProps) {
  const barcode = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(barcodeSvg)}`;
  return (
    <article
      aria-label={`${what} label ${reference}`}
      className={`mx-auto grid w-full max-w-[100mm] gap-3 border-2 border-dashed border-cast bg-white p-4 text-ink print:border-ink ${className}`}
    >
      <header className="flex items-baseline justify-between gap-3 border-b-4 border-ink pb-2">
        <p className="text-3xl font-bold tracking-wide">{heading}</p>
        <p className="text-sm">{formatDate(createdAt)}</p>
      </header>
      <section aria-label="Deliver to">
        <p className="text-xs font-semibold uppercase tracking-wider">To</p>
        <p className="text-lg font-bold leading-tight">{OUR_ADDRESS.name}</p>
        <p className="leading-tight">{desk}</p>
        <p className="leading-tight">{OUR_ADDRESS.address}</p>
      </section>
      <section aria-label="From">
        <p className="text-xs font-semibold uppercase tracking-wider">From</p>
        <p className="leading-tight">{from.name}</p>
        <p className="leading-tight">{from.line1}</p>
        <p className="leading-tight">
          {from.city} {from.postcode}
        </p>
      </section>
      <figure className="grid justify-items-center gap-1 border-y-2 border-ink py-3">
        <img src={barcode} alt={`Barcode of ${barcodeOf} ${reference}`} className="h-24 w-full max-w-[80mm] object-contain [image-rendering:crisp-edges]" />
        <figcaption className="part-no text-2xl tracking-widest">{reference}</figcaption>
      </figure>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">{children}</dl>
    </article>
  );
}
