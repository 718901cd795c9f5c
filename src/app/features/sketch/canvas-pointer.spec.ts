import { hitOf } from './canvas-pointer';

describe('hitOf', () => {
  function svgWith(markup: string): SVGSVGElement {
    const svg = document.createElementNS('http://www.w3.org/2000/svg', 'svg');
    svg.innerHTML = markup;
    return svg;
  }

  it('reads the hit code of the element or the nearest one around it', () => {
    const svg = svgWith('<path data-hit="shape:2"/><g data-hit="port:0"><text>P1</text></g><g class="rotate"><circle data-hit="rotate"/></g>');
    expect(hitOf(svg.querySelector('path'))).toEqual({ kind: 'shape', index: 2 });
    expect(hitOf(svg.querySelector('text'))).toEqual({ kind: 'port', index: 0 });
    expect(hitOf(svg.querySelector('circle'))).toEqual({ kind: 'rotate' });
  });

  it('finds nothing over empty space, unknown codes or no element', () => {
    const svg = svgWith('<rect class="bg"/><path data-hit="zone:1"/>');
    expect(hitOf(svg.querySelector('rect'))).toBeNull();
    expect(hitOf(svg.querySelector('path'))).toBeNull();
    expect(hitOf(null)).toBeNull();
  });
});
