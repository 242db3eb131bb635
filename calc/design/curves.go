package design

import (
	"encoding/binary"
	"math"
	"sync"

	"colsheet/calc/material"
	"colsheet/calc/section"
)

// curveMemo holds the N–M diagrams of the sections of a run by their content, so that lifts
// with the same section (typical bars, repeated sizes) share one diagram: the diagram depends
// only on the section, its bars and materials and the axis or direction, never on the actions.
// It is safe for use by several workers; it stops growing at memoLimit sections.
type curveMemo struct {
	mu sync.Mutex
	m  map[string][]section.NMPoint
}

// memoLimit is the most diagrams a run keeps (about 1.2 kB each at curvePoints).
const memoLimit = 8192

// nm returns the diagram of key, made by f when not yet held.
func (c *curveMemo) nm(key []byte, f func() []section.NMPoint) []section.NMPoint {
	if c == nil {
		return f()
	}
	c.mu.Lock()
	v, ok := c.m[string(key)]
	c.mu.Unlock()
	if ok {
		return v
	}
	v = f()
	c.mu.Lock()
	if c.m == nil {
		c.m = make(map[string][]section.NMPoint)
	}
	if len(c.m) < memoLimit {
		c.m[string(key)] = v
	}
	c.mu.Unlock()
	return v
}

// curveKey appends the content of a section that its N–M diagram depends on: shape, size,
// materials, stress block, bars and axis or direction, every number by its exact bits.
func curveKey(b []byte, shape byte, size [2]float64, bars []section.Bar, fcd, fyd, es float64, block section.Block, c material.Concrete, dir float64) []byte {
	f := func(v float64) { b = binary.LittleEndian.AppendUint64(b, math.Float64bits(v)) }
	b = append(b, shape, byte(block))
	b = append(b, c.Class...)
	b = append(b, 0)
	for _, v := range [...]float64{size[0], size[1], fcd, fyd, es, dir, c.Fck, c.FckCub, c.Fcm, c.Fctm, c.Ecm,
		c.EpsC2, c.EpsCu2, c.N, c.EpsC3, c.EpsCu3, c.Lambda, c.Eta} {
		f(v)
	}
	for _, bar := range bars {
		f(bar.Y)
		f(bar.Z)
		f(bar.Area)
	}
	return b
}
