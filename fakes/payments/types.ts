// Object shapes the fake keeps and returns, modelled on the payments API's objects
// (field names and value sets as the stripe@23 type definitions describe them).
import type { Metadata } from "./params";

export type CapabilityStatus = "active" | "inactive" | "pending";

export interface ListObject<T> {
  object: "list";
  data: T[];
  has_more: boolean;
  url: string;
  total_count?: number;
}

export interface BankAccount {
  id: string;
  object: "bank_account";
  account: string;
  account_holder_name: string;
  country: string;
  currency: string;
  last4: string;
  routing_number: string;
  status: "new" | "verified";
  default_for_currency: boolean;
  metadata: Metadata;
}

export interface Account {
  id: string;
  object: "account";
  type: "express" | "standard" | "custom";
  country: string;
  email: string | null;
  created: number;
  livemode: false;
  metadata: Metadata;
  default_currency: string;
  business_type: string | null;
  business_profile: Record<string, string | null>;
  capabilities: Record<string, CapabilityStatus>;
  charges_enabled: boolean;
  payouts_enabled: boolean;
  details_submitted: boolean;
  requirements: {
    currently_due: string[];
    eventually_due: string[];
    past_due: string[];
    pending_verification: string[];
    disabled_reason: string | null;
    current_deadline: number | null;
  };
  tos_acceptance: { date: number | null };
  external_accounts: ListObject<BankAccount>;
}

export interface DeletedObject {
  id: string;
  object: string;
  deleted: true;
}

/** The fake's own record behind an account link URL; the API returns only its public face. */
export interface AccountLinkRecord {
  id: string;
  account: string;
  type: "account_onboarding" | "account_update";
  refresh_url: string;
  return_url: string;
  created: number;
  expires_at: number;
  used: boolean;
}

export interface LineItem {
  id: string;
  object: "item";
  amount_discount: number;
  amount_subtotal: number;
  amount_tax: number;
  amount_total: number;
  currency: string;
  description: string;
  quantity: number;
  price: {
    id: string;
    object: "price";
    active: boolean;
    currency: string;
    unit_amount: number;
    product: string;
    type: "one_time";
    livemode: false;
    metadata: Metadata;
  };
}

export interface PaymentIntentData {
  metadata: Metadata;
  transfer_group: string | null;
  capture_method: "automatic" | "automatic_async" | "manual";
  application_fee_amount: number | null;
  transfer_data: { destination: string; amount?: number } | null;
  description: string | null;
  receipt_email: string | null;
}

export interface CheckoutSession {
  id: string;
  object: "checkout.session";
  allowed_payment_method_types: string[] | null;
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer: null;
  customer_details: { email: string | null; name: string | null } | null;
  customer_email: string | null;
  expires_at: number;
  livemode: false;
  metadata: Metadata;
  mode: "payment";
  payment_intent: string | null;
  payment_method_types: string[];
  payment_status: "paid" | "unpaid";
  status: "open" | "complete" | "expired";
  success_url: string;
  ui_mode: "hosted_page";
  url: string | null;
}

export type PaymentIntentStatus =
  | "requires_payment_method"
  | "requires_confirmation"
  | "requires_capture"
  | "succeeded"
  | "canceled";

export interface PaymentError {
  type: "card_error";
  code: string;
  decline_code?: string;
  message: string;
  charge?: string;
  payment_method?: { id: string; object: "payment_method"; type: "card" };
}

export interface PaymentIntent {
  id: string;
  object: "payment_intent";
  amount: number;
  allowed_payment_method_types: string[] | null;
  amount_capturable: number;
  amount_received: number;
  application_fee_amount: number | null;
  automatic_payment_methods: { enabled: boolean; allow_redirects?: "always" | "never" } | null;
  canceled_at: number | null;
  cancellation_reason: string | null;
  capture_method: "automatic" | "automatic_async" | "manual";
  client_secret: string;
  confirmation_method: "automatic";
  created: number;
  currency: string;
  description: string | null;
  last_payment_error: PaymentError | null;
  latest_charge: string | null;
  livemode: false;
  metadata: Metadata;
  payment_method: string | null;
  payment_method_types: string[];
  receipt_email: string | null;
  return_url?: string | null;
  status: PaymentIntentStatus;
  transfer_data: { destination: string; amount?: number } | null;
  transfer_group: string | null;
}

export interface Charge {
  id: string;
  object: "charge";
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  application_fee_amount: number | null;
  balance_transaction: string | null;
  billing_details: { email: string | null; name: string | null };
  captured: boolean;
  created: number;
  currency: string;
  description: string | null;
  failure_code: string | null;
  failure_message: string | null;
  livemode: false;
  metadata: Metadata;
  outcome: {
    network_status: "approved_by_network" | "declined_by_network";
    reason: string | null;
    seller_message: string;
    type: "authorized" | "issuer_declined";
  };
  paid: boolean;
  payment_intent: string;
  payment_method: string;
  payment_method_details: { type: "card"; card: { last4: string; exp_month: number; exp_year: number } };
  refunded: boolean;
  status: "succeeded" | "failed";
  transfer: string | null;
  transfer_data: { destination: string; amount?: number } | null;
  transfer_group: string | null;
}

export interface Refund {
  id: string;
  object: "refund";
  amount: number;
  balance_transaction: string;
  charge: string;
  created: number;
  currency: string;
  metadata: Metadata;
  payment_intent: string;
  reason: "duplicate" | "fraudulent" | "requested_by_customer" | null;
  status: "succeeded";
}

export interface TransferReversal {
  id: string;
  object: "transfer_reversal";
  amount: number;
  balance_transaction: string;
  created: number;
  currency: string;
  metadata: Metadata;
  transfer: string;
}

export interface Transfer {
  id: string;
  object: "transfer";
  amount: number;
  amount_reversed: number;
  balance_transaction: string;
  created: number;
  currency: string;
  description: string | null;
  destination: string;
  destination_payment: string;
  livemode: false;
  metadata: Metadata;
  reversals: ListObject<TransferReversal>;
  reversed: boolean;
  source_transaction: string | null;
  source_type: "card";
  transfer_group: string | null;
}

export interface ApiEvent {
  id: string;
  object: "event";
  api_version: string;
  created: number;
  data: { object: unknown; previous_attributes?: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}
