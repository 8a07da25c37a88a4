import type { ReactNode } from 'react';

type Tone = 'agree' | 'caution' | 'hazard' | 'info';

const tones: Record<Tone, string> = {
  agree: 'border-agree bg-agree-soft',
  caution: 'border-caution bg-caution-soft',
  hazard: 'border-hazard bg-hazard-soft',
  info: 'border-rule bg-sheet',
};

export function Alert({ tone = 'info', title, children }: { tone?: Tone; title?: string; children?: ReactNode }) {
  return (
    <div role={tone === 'caution' || tone === 'hazard' ? 'alert' : 'status'} className={`rounded-md border-l-4 px-4 py-3 text-sm ${tones[tone]}`}>
      {title && <p className="font-semibold">{title}</p>}
      {children && <div className={title ? 'mt-1' : ''}>{children}</div>}
    </div>
  );
}
