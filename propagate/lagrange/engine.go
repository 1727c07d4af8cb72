package lagrange

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/num/hyperdual"
)

// MaxDim is the largest number of generalized coordinates a [System] takes.
const MaxDim = 6

// Func is a Lagrangian L(t, q, qdot) written over hyperdual numbers. It must
// use only hyperdual arithmetic on its arguments (constants enter with zero
// infinitesimal parts) so that the engine can read exact first and second
// derivatives from the result. It must not retain q or qdot.
type Func func(t hyperdual.Number, q, qdot []hyperdual.Number) hyperdual.Number

// Force writes into dst the generalized non-conservative forces Q_i
// (dimensions of dL/dq_i) at (t, q, qdot): for example drag or radiation
// pressure projected on the coordinates. It must not retain its arguments.
type Force func(dst []float64, t float64, q, qdot []float64) error

var (
	// ErrDim reports a number of coordinates outside 1..MaxDim.
	ErrDim = errors.New("lagrange: number of coordinates out of range")
	// ErrSingular reports a mass matrix d2L/dqdot2 that cannot be inverted.
	ErrSingular = errors.New("lagrange: singular mass matrix")
)

// StateError carries the time and coordinates at which the equations of
// motion could not be formed.
type StateError struct {
	T       float64
	Q, QDot []float64
	Err     error
}

func (e *StateError) Error() string {
	return fmt.Sprintf("%v at t = %.17g, q = %.10g, qdot = %.10g", e.Err, e.T, e.Q, e.QDot)
}

func (e *StateError) Unwrap() error { return e.Err }

// System derives the Euler-Lagrange equations of a Lagrangian. For n
// coordinates it solves
//
//	M qddot = g + Q - C qdot - d2L/(dqdot dt),
//	M = d2L/dqdot2, C = d2L/(dqdot dq), g = dL/dq,
//
// with every derivative exact (hyperdual numbers, no finite differences).
// One call of [System.Accelerations] costs n(n+1)/2 + n + ceil(n/2)
// evaluations of L: the Hessian M entry by entry, the vector C qdot + L_qdot,t
// as a directional derivative along (qdot, 1) in (q, t), and the gradient g
// two components at a time. A System holds its scratch space and does not
// allocate; it is not safe for concurrent use.
type System struct {
	n  int
	l  Func
	f  Force
	q  [MaxDim]hyperdual.Number
	qd [MaxDim]hyperdual.Number
	qf [MaxDim]float64
}

// New returns the engine for the Lagrangian l in n coordinates with the
// generalized forces f (nil for none).
func New(n int, l Func, f Force) (*System, error) {
	if n < 1 || n > MaxDim {
		return nil, fmt.Errorf("%w: n = %d, want 1..%d", ErrDim, n, MaxDim)
	}
	if l == nil {
		return nil, fmt.Errorf("%w: nil Lagrangian", ErrParameter)
	}
	return &System{n: n, l: l, f: f}, nil
}

// Dim returns the number of generalized coordinates.
func (s *System) Dim() int { return s.n }

func (s *System) load(q, qdot []float64) {
	for i := 0; i < s.n; i++ {
		s.q[i] = hyperdual.Number{Real: q[i]}
		s.qd[i] = hyperdual.Number{Real: qdot[i]}
	}
}

func (s *System) call(t hyperdual.Number) hyperdual.Number {
	return s.l(t, s.q[:s.n], s.qd[:s.n])
}

// Accelerations writes the generalized accelerations qddot into dst.
func (s *System) Accelerations(dst []float64, t float64, q, qdot []float64) error {
	n := s.n
	if len(dst) != n || len(q) != n || len(qdot) != n {
		panic(fmt.Sprintf("lagrange: lengths %d, %d, %d, want %d", len(dst), len(q), len(qdot), n))
	}
	var m [MaxDim][MaxDim]float64
	var rhs [MaxDim]float64
	tr := hyperdual.Number{Real: t}
	s.load(q, qdot)
	// Mass matrix, upper triangle.
	for i := 0; i < n; i++ {
		for j := i; j < n; j++ {
			if i == j {
				s.qd[i] = hyperdual.Number{Real: qdot[i], E1mag: 1, E2mag: 1}
			} else {
				s.qd[i].E1mag = 1
				s.qd[j].E2mag = 1
			}
			v := s.call(tr)
			m[i][j], m[j][i] = v.E1E2mag, v.E1E2mag
			s.qd[i] = hyperdual.Number{Real: qdot[i]}
			s.qd[j] = hyperdual.Number{Real: qdot[j]}
		}
	}
	// C qdot + d2L/dqdot dt: E1 on qdot_i, E2 along (qdot, 1) in (q, t).
	for k := 0; k < n; k++ {
		s.q[k].E2mag = qdot[k]
	}
	td := hyperdual.Number{Real: t, E2mag: 1}
	for i := 0; i < n; i++ {
		s.qd[i].E1mag = 1
		v := s.call(td)
		rhs[i] = -v.E1E2mag
		s.qd[i].E1mag = 0
	}
	for k := 0; k < n; k++ {
		s.q[k].E2mag = 0
	}
	// Gradient dL/dq, two components per evaluation.
	for i := 0; i < n; i += 2 {
		s.q[i].E1mag = 1
		if i+1 < n {
			s.q[i+1].E2mag = 1
		}
		v := s.call(tr)
		rhs[i] += v.E1mag
		s.q[i].E1mag = 0
		if i+1 < n {
			rhs[i+1] += v.E2mag
			s.q[i+1].E2mag = 0
		}
	}
	if s.f != nil {
		qf := s.qf[:n]
		if err := s.f(qf, t, q, qdot); err != nil {
			return err
		}
		for i := range qf {
			rhs[i] += qf[i]
		}
	}
	if !solve(&m, &rhs, n) {
		return &StateError{T: t, Q: append([]float64(nil), q...), QDot: append([]float64(nil), qdot...), Err: ErrSingular}
	}
	copy(dst, rhs[:n])
	return nil
}

// Derivative is the first-order form for an integrator: y = (q, qdot),
// dst = (qdot, qddot). Its signature matches integrate.Func.
func (s *System) Derivative(dst []float64, t float64, y []float64) error {
	n := s.n
	if len(y) != 2*n || len(dst) != 2*n {
		panic(fmt.Sprintf("lagrange: len(y) = %d, len(dst) = %d, want %d", len(y), len(dst), 2*n))
	}
	copy(dst[:n], y[n:])
	return s.Accelerations(dst[n:], t, y[:n], y[n:])
}

// Momenta writes the generalized momenta p_i = dL/dqdot_i into dst.
func (s *System) Momenta(dst []float64, t float64, q, qdot []float64) {
	s.load(q, qdot)
	tr := hyperdual.Number{Real: t}
	for i := 0; i < s.n; i += 2 {
		s.qd[i].E1mag = 1
		if i+1 < s.n {
			s.qd[i+1].E2mag = 1
		}
		v := s.call(tr)
		dst[i] = v.E1mag
		s.qd[i].E1mag = 0
		if i+1 < s.n {
			dst[i+1] = v.E2mag
			s.qd[i+1].E2mag = 0
		}
	}
}

// Energy returns the Jacobi integral h = sum_i qdot_i dL/dqdot_i - L,
// conserved when L does not depend on t and there are no generalized
// forces (the total energy T + U when T is quadratic in qdot). It costs
// one evaluation: the derivative of L along qdot.
func (s *System) Energy(t float64, q, qdot []float64) float64 {
	s.load(q, qdot)
	for i := 0; i < s.n; i++ {
		s.qd[i].E1mag = qdot[i]
	}
	v := s.call(hyperdual.Number{Real: t})
	return v.E1mag - v.Real
}

// Lagrangian returns L(t, q, qdot).
func (s *System) Lagrangian(t float64, q, qdot []float64) float64 {
	s.load(q, qdot)
	return s.call(hyperdual.Number{Real: t}).Real
}

// solve overwrites b with the solution of m x = b by Gaussian elimination
// with partial pivoting. It reports false for an exactly singular matrix.
func solve(m *[MaxDim][MaxDim]float64, b *[MaxDim]float64, n int) bool {
	for col := 0; col < n; col++ {
		p := col
		for r := col + 1; r < n; r++ {
			if math.Abs(m[r][col]) > math.Abs(m[p][col]) {
				p = r
			}
		}
		if m[p][col] == 0 {
			return false
		}
		if p != col {
			m[p], m[col] = m[col], m[p]
			b[p], b[col] = b[col], b[p]
		}
		inv := 1 / m[col][col]
		for r := col + 1; r < n; r++ {
			f := m[r][col] * inv
			if f == 0 {
				continue
			}
			for c := col; c < n; c++ {
				m[r][c] -= f * m[col][c]
			}
			b[r] -= f * b[col]
		}
	}
	for r := n - 1; r >= 0; r-- {
		sum := b[r]
		for c := r + 1; c < n; c++ {
			sum -= m[r][c] * b[c]
		}
		b[r] = sum / m[r][r]
	}
	return true
}
