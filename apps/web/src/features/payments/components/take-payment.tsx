import { useMutation } from '@tanstack/react-query';
import { formatPence } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { createPayLink } from '../api/payment-queries';

/**
 * The pay QR for the doorstep: the customer scans it with their own phone and pays on the payment service's page,
 * so their card never touches this phone. The code is made by the server (an SVG of the link).
 */
export function TakePayment({ invoiceId, duePence }: { invoiceId: number; duePence: number }) {
  const link = useMutation({ mutationFn: () => createPayLink(invoiceId) });
  if (!link.data) {
    return (
      <div className="space-y-2">
        <Button onClick={() => link.mutate()} busy={link.isPending}>
          Show pay QR code ({formatPence(duePence)})
        </Button>
        {link.isError ? <Alert tone="error">{link.error.message}</Alert> : null}
      </div>
    );
  }
  return (
    <figure className="space-y-2 rounded-md border border-line p-3 text-center">
      <img
        src={`data:image/svg+xml;utf8,${encodeURIComponent(link.data.qrSvg)}`}
        alt="QR code: the customer scans it to pay by card on their own phone"
        className="mx-auto h-64 w-64 bg-white"
      />
      <figcaption className="space-y-1">
        <p className="font-semibold">Ask the customer to scan this with their phone&rsquo;s camera.</p>
        <p className="text-sm break-all">
          <a href={link.data.url} className="text-brand-700 underline" data-testid="pay-link">
            {link.data.url}
          </a>
        </p>
      </figcaption>
    </figure>
  );
}
