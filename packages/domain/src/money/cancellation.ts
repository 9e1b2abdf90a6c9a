// Work agreed in the customer's home is an off-premises contract under the Consumer Contracts
// (Information, Cancellation and Additional Charges) Regulations 2013 (SI 2013/3134). Regulation 10 and
// Schedule 2 ask for the cancellation information before the contract binds; Schedule 3 gives the model
// instructions (Part A) and the model cancellation form (Part B). The wording below follows Schedule 3
// (from memory of the published text, Crown copyright under the Open Government Licence), with the firm's
// details filled in where the Schedule leaves a blank.

export interface CancellationFirm {
  name: string;
  address: string | null;
  phone: string | null;
  email: string | null;
}

/** The cancellation period: 14 days from the day the contract is made (regulations 29 and 30(3)). */
export const CANCELLATION_PERIOD_DAYS = 14;

function firmLine(f: CancellationFirm): string {
  return [f.name, f.address?.replace(/\s*\n\s*/g, ', '), f.phone && `phone ${f.phone}`, f.email && `e-mail ${f.email}`]
    .filter(Boolean)
    .join(', ');
}

/** Schedule 3, Part A: the model instructions for cancellation, for a contract for services. */
export function cancellationInformation(f: CancellationFirm): string[] {
  return [
    'Right to cancel',
    `You have the right to cancel this contract within ${CANCELLATION_PERIOD_DAYS} days without giving any reason.`,
    `The cancellation period will expire after ${CANCELLATION_PERIOD_DAYS} days from the day of the conclusion of the contract.`,
    `To exercise the right to cancel, you must inform us (${firmLine(f)}) of your decision to cancel this contract by a clear statement (e.g. a letter sent by post or e-mail). You may use the model cancellation form below, but it is not obligatory.`,
    'To meet the cancellation deadline, it is sufficient for you to send your communication concerning your exercise of the right to cancel before the cancellation period has expired.',
    'Effects of cancellation',
    'If you cancel this contract, we will reimburse to you all payments received from you. We will make the reimbursement without undue delay, and not later than 14 days after the day on which we are informed about your decision to cancel this contract, using the same means of payment as you used for the initial transaction, unless you have expressly agreed otherwise; in any event, you will not incur any fees as a result of the reimbursement.',
    'If you requested us to begin the performance of services during the cancellation period, you shall pay us an amount which is in proportion to what has been performed until you have communicated us your cancellation of this contract, in comparison with the full coverage of the contract.',
    'If the service is fully performed within the cancellation period at your express request, you will lose the right to cancel once it has been fully performed.',
  ];
}

/** Schedule 3, Part B: the model cancellation form. */
export function modelCancellationForm(f: CancellationFirm, quoteNumber: string): string[] {
  return [
    'Model cancellation form (complete and return this form only if you wish to cancel the contract)',
    `To: ${firmLine(f)}`,
    `I/We [*] hereby give notice that I/We [*] cancel my/our [*] contract for the supply of the following service [*]: quote ${quoteNumber}`,
    'Ordered on [*]',
    'Name of consumer(s):',
    'Address of consumer(s):',
    'Signature of consumer(s) (only if this form is notified on paper):',
    'Date:',
    '[*] Delete as appropriate.',
  ];
}

/** The words the customer ticks to ask for the work within the cancellation period (regulation 36). */
export const EXPRESS_REQUEST_WORDS =
  'I ask for the work to be done within the 14-day cancellation period. I understand that if I cancel after the work has started I must pay for what has been done, and that I lose the right to cancel once the work is complete.';
