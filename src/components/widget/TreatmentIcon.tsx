import type { ReactElement } from 'react';

/** A small picture of each treatment for the choice cards (decorative; the name is the label). */
export function TreatmentIcon({ kind, orientation }: { kind: string; orientation?: 'vertical' | 'horizontal' }) {
  const stroke = '#1F2A2E';
  const wood = '#EEDFC0';
  const lines: ReactElement[] = [];
  if (kind === 'shiplap' && orientation === 'horizontal') {
    for (let y = 10; y < 60; y += 10) lines.push(<line key={y} x1="4" y1={y} x2="76" y2={y} stroke={stroke} strokeWidth="1.2" />);
  } else if (kind === 'shiplap') {
    for (let x = 14; x < 76; x += 10) lines.push(<line key={x} x1={x} y1="4" x2={x} y2="60" stroke={stroke} strokeWidth="1.2" />);
  } else if (kind === 'beadboard') {
    for (let x = 8; x < 76; x += 4) lines.push(<line key={x} x1={x} y1="22" x2={x} y2="60" stroke={stroke} strokeWidth="0.6" />);
    lines.push(<rect key="cap" x="4" y="18" width="72" height="4" fill="#DCC59A" stroke={stroke} strokeWidth="0.8" />);
  } else if (kind === 'board-and-batten') {
    for (let x = 4; x <= 72; x += 17) lines.push(<rect key={x} x={x} y="22" width="4" height="38" fill="#DCC59A" stroke={stroke} strokeWidth="0.8" />);
    lines.push(<rect key="rail" x="4" y="18" width="72" height="4" fill="#DCC59A" stroke={stroke} strokeWidth="0.8" />);
  } else if (kind === 'flat-panel') {
    for (let x = 4; x < 72; x += 24) lines.push(<rect key={x} x={x + 4} y="26" width="16" height="28" fill="none" stroke={stroke} strokeWidth="0.8" />);
    lines.push(<rect key="cap" x="4" y="18" width="72" height="4" fill="#DCC59A" stroke={stroke} strokeWidth="0.8" />);
  } else {
    lines.push(<rect key="a" x="10" y="8" width="26" height="22" fill="none" stroke={stroke} strokeWidth="1.2" />);
    lines.push(<rect key="b" x="44" y="8" width="26" height="22" fill="none" stroke={stroke} strokeWidth="1.2" />);
    lines.push(<rect key="c" x="10" y="38" width="60" height="18" fill="none" stroke={stroke} strokeWidth="1.2" />);
  }
  return (
    <svg viewBox="0 0 80 64" width="80" height="64" aria-hidden="true" focusable="false">
      <rect x="4" y="4" width="72" height="56" fill={kind === 'picture-frame' ? '#FFFFFF' : wood} stroke={stroke} strokeWidth="1.2" />
      {lines}
    </svg>
  );
}
