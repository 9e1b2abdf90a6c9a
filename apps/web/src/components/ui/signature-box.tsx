import { useEffect, useId, useRef, useState } from 'react';
import SignaturePad from 'signature_pad';
import { Button } from '@/components/ui/button';

/**
 * A drawn signature, by finger or stylus, through the signature_pad package. The PNG is kept small
 * (at most twice the box's CSS size, a transparent background) so it goes in one JSON request.
 */
export function SignatureBox({
  label,
  onChange,
  disabled = false,
}: {
  label: string;
  /** The drawing as a PNG data URL after each stroke, or null once cleared. */
  onChange: (pngDataUrl: string | null) => void;
  disabled?: boolean;
}) {
  const id = useId();
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const padRef = useRef<SignaturePad | null>(null);
  const onChangeRef = useRef(onChange);
  const [empty, setEmpty] = useState(true);

  useEffect(() => {
    onChangeRef.current = onChange;
  }, [onChange]);

  useEffect(() => {
    const canvas = canvasRef.current;
    if (!canvas) return;
    const pad = new SignaturePad(canvas, { penColor: '#16262a', minWidth: 1, maxWidth: 2.5 });
    const ratio = Math.min(window.devicePixelRatio || 1, 2);
    canvas.width = canvas.offsetWidth * ratio;
    canvas.height = canvas.offsetHeight * ratio;
    canvas.getContext('2d')?.scale(ratio, ratio);
    pad.clear();
    const ended = () => {
      setEmpty(pad.isEmpty());
      onChangeRef.current(pad.isEmpty() ? null : pad.toDataURL('image/png'));
    };
    pad.addEventListener('endStroke', ended);
    padRef.current = pad;
    return () => {
      pad.removeEventListener('endStroke', ended);
      pad.off();
      padRef.current = null;
    };
  }, []);

  useEffect(() => {
    const pad = padRef.current;
    if (!pad) return;
    if (disabled) pad.off();
    else pad.on();
  }, [disabled]);

  const clear = () => {
    padRef.current?.clear();
    setEmpty(true);
    onChangeRef.current(null);
  };

  return (
    <div role="group" aria-labelledby={`${id}-label`} className="space-y-2">
      <p id={`${id}-label`} className="font-semibold">
        {label}
      </p>
      <canvas
        ref={canvasRef}
        aria-describedby={`${id}-hint`}
        className="block h-40 w-full touch-none rounded-md border-2 border-line-strong bg-card"
      />
      <div className="flex items-center justify-between gap-3">
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {empty ? 'Sign in the box with a finger.' : 'Signed. Clear it to sign again.'}
        </p>
        <Button variant="secondary" className="min-h-12" onClick={clear} disabled={empty || disabled}>
          Clear
        </Button>
      </div>
    </div>
  );
}
