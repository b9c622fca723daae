import type uPlot from 'uplot';

/** Nights drawn as shaded bands behind the series (DESIGN.md §9). Times in Unix seconds. */
export function nightBandsPlugin(nights: { from: number; to: number }[], fill = 'rgba(120, 134, 164, 0.13)'): uPlot.Plugin {
  return {
    hooks: {
      drawClear: (u: uPlot) => {
        const { ctx } = u;
        const { top, height } = u.bbox;
        ctx.save();
        ctx.fillStyle = fill;
        for (const n of nights) {
          const x0 = u.valToPos(n.from, 'x', true);
          const x1 = u.valToPos(n.to, 'x', true);
          const left = Math.max(x0, u.bbox.left);
          const right = Math.min(x1, u.bbox.left + u.bbox.width);
          if (right > left) ctx.fillRect(left, top, right - left, height);
        }
        ctx.restore();
      },
    },
  };
}

/** Horizontal reference lines on a y scale: the burst floor dashed, the cutoff dotted. */
export interface RefLine {
  value: number;
  scale: string;
  label: string;
  color: string;
  dash: number[];
  /** Where the label sits; "below" keeps two close lines (floor and cutoff) from writing over each other. */
  labelSide?: 'above' | 'below';
}

/** Canvas text in the app's figures face (next/font puts its family in --font-figures on <html>). */
function figuresFont(): string {
  const family = getComputedStyle(document.documentElement).getPropertyValue('--font-figures').trim();
  return `${Math.round(11 * devicePixelRatio)}px ${family ? `${family}, ` : ''}ui-monospace, monospace`;
}

export function refLinesPlugin(lines: RefLine[]): uPlot.Plugin {
  return {
    hooks: {
      draw: (u: uPlot) => {
        const { ctx } = u;
        const { left, width } = u.bbox;
        ctx.save();
        ctx.font = figuresFont();
        // uPlot leaves its own alignment on the context after drawing axes: set ours.
        ctx.textAlign = 'left';
        for (const l of lines) {
          const y = u.valToPos(l.value, l.scale, true);
          if (!Number.isFinite(y)) continue;
          ctx.strokeStyle = l.color;
          ctx.fillStyle = l.color;
          ctx.lineWidth = 1.5 * devicePixelRatio;
          ctx.setLineDash(l.dash.map((d) => d * devicePixelRatio));
          ctx.beginPath();
          ctx.moveTo(left, y);
          ctx.lineTo(left + width, y);
          ctx.stroke();
          ctx.textBaseline = l.labelSide === 'below' ? 'top' : 'alphabetic';
          ctx.fillText(l.label, left + 6 * devicePixelRatio, l.labelSide === 'below' ? y + 3 * devicePixelRatio : y - 4 * devicePixelRatio);
        }
        ctx.restore();
      },
    },
  };
}

/** Vertical ticks at given instants (the sunrise tick that ends a projection). */
export function timeMarksPlugin(marks: { at: number; label: string; color: string }[]): uPlot.Plugin {
  return {
    hooks: {
      draw: (u: uPlot) => {
        const { ctx } = u;
        const { top, height, left, width } = u.bbox;
        ctx.save();
        ctx.font = figuresFont();
        ctx.textBaseline = 'alphabetic';
        marks.forEach((m, i) => {
          const x = u.valToPos(m.at, 'x', true);
          // a mark outside the plotted span would be drawn over the axis: leave it out
          if (!Number.isFinite(x) || x < left - 1 || x > left + width + 1) return;
          ctx.strokeStyle = m.color;
          ctx.fillStyle = m.color;
          ctx.lineWidth = 2 * devicePixelRatio;
          ctx.setLineDash([]);
          ctx.beginPath();
          ctx.moveTo(x, top + height);
          ctx.lineTo(x, top + height - 14 * devicePixelRatio);
          ctx.stroke();
          // Near the right edge the label goes to the tick's left, so it is never cut off.
          const room = left + width - x;
          const textWidth = ctx.measureText(m.label).width;
          ctx.textAlign = room < textWidth + 8 * devicePixelRatio ? 'right' : 'left';
          // each further mark's label one line higher, so two close marks stay readable
          ctx.fillText(m.label, ctx.textAlign === 'right' ? x - 4 * devicePixelRatio : x + 4 * devicePixelRatio, top + height - (18 + 14 * i) * devicePixelRatio);
        });
        ctx.restore();
      },
    },
  };
}
