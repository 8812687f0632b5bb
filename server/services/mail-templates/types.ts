import type { CategorySlug } from '../../../shared/catalog';

/** What every template returns: a subject and two parts that each stand on their own. */
export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

export interface MailAddress {
  name: string;
  company?: string | undefined;
  lines: string[];
  city: string;
  region?: string | undefined;
  postalCode: string;
  country?: string | undefined;
}

/** A part as it appears on an order-related message. */
export interface MailPartRef {
  partNumber: string;
  title: string;
  /** Complete turbochargers and cartridges carry the fitting caution. */
  category: CategorySlug;
}
