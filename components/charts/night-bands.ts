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
}

export function refLinesPlugin(lines: RefLine[]): uPlot.Plugin {
  return {
    hooks: {
      draw: (u: uPlot) => {
        const { ctx } = u;
        const { left, width } = u.bbox;
        ctx.save();
        ctx.font = `${Math.round(11 * devicePixelRatio)}px var(--font-figures), monospace`;
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
          ctx.fillText(l.label, left + 6 * devicePixelRatio, y - 4 * devicePixelRatio);
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
        const { top, height } = u.bbox;
        ctx.save();
        ctx.font = `${Math.round(11 * devicePixelRatio)}px var(--font-figures), monospace`;
        for (const m of marks) {
          const x = u.valToPos(m.at, 'x', true);
          if (!Number.isFinite(x)) continue;
          ctx.strokeStyle = m.color;
          ctx.fillStyle = m.color;
          ctx.lineWidth = 2 * devicePixelRatio;
          ctx.setLineDash([]);
          ctx.beginPath();
          ctx.moveTo(x, top + height);
          ctx.lineTo(x, top + height - 14 * devicePixelRatio);
          ctx.stroke();
          ctx.fillText(m.label, x + 4 * devicePixelRatio, top + height - 4 * devicePixelRatio);
        }
        ctx.restore();
      },
    },
  };
}
