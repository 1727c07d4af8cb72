package integrate

import "math"

// stage writes into ys the argument y + h sum_j a[st][j] k_j of stage st
// (1 <= st <= 15), unrolled over the non-zero coefficients of a (written
// out from their pattern in coefficients.go; TestStages checks the result
// against the plain sum over all coefficients). The
// coefficients are loaded into locals before the loop so that they stay in
// registers (a store to ys could otherwise alias them), and each component
// accumulates in a register; the sums run in the order of j, so results are
// bit for bit those of the plain loop.
func stage(st int, ys, y []float64, h float64, k *[16][]float64) {
	n := len(ys)
	y = y[:n]
	switch st {
	case 1:
		c0 := a[1][0]
		k0 := k[0][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i])
		}
	case 2:
		c0, c1 := a[2][0], a[2][1]
		k0 := k[0][:n]
		k1 := k[1][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c1*k1[i])
		}
	case 3:
		c0, c2 := a[3][0], a[3][2]
		k0 := k[0][:n]
		k2 := k[2][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c2*k2[i])
		}
	case 4:
		c0, c2, c3 := a[4][0], a[4][2], a[4][3]
		k0 := k[0][:n]
		k2 := k[2][:n]
		k3 := k[3][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c2*k2[i]+c3*k3[i])
		}
	case 5:
		c0, c3, c4 := a[5][0], a[5][3], a[5][4]
		k0 := k[0][:n]
		k3 := k[3][:n]
		k4 := k[4][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c3*k3[i]+c4*k4[i])
		}
	case 6:
		c0, c3, c4, c5 := a[6][0], a[6][3], a[6][4], a[6][5]
		k0 := k[0][:n]
		k3 := k[3][:n]
		k4 := k[4][:n]
		k5 := k[5][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c3*k3[i]+c4*k4[i]+c5*k5[i])
		}
	case 7:
		c0, c3, c4, c5, c6 := a[7][0], a[7][3], a[7][4], a[7][5], a[7][6]
		k0 := k[0][:n]
		k3 := k[3][:n]
		k4 := k[4][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c3*k3[i]+c4*k4[i]+c5*k5[i]+c6*k6[i])
		}
	case 8:
		c0, c3, c4, c5, c6, c7 := a[8][0], a[8][3], a[8][4], a[8][5], a[8][6], a[8][7]
		k0 := k[0][:n]
		k3 := k[3][:n]
		k4 := k[4][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c3*k3[i]+c4*k4[i]+c5*k5[i]+c6*k6[i]+c7*k7[i])
		}
	case 9:
		c0, c3, c4, c5, c6, c7, c8 := a[9][0], a[9][3], a[9][4], a[9][5], a[9][6], a[9][7], a[9][8]
		k0 := k[0][:n]
		k3 := k[3][:n]
		k4 := k[4][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		k8 := k[8][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c3*k3[i]+c4*k4[i]+c5*k5[i]+c6*k6[i]+c7*k7[i]+c8*k8[i])
		}
	case 10:
		c0, c3, c4, c5, c6, c7, c8, c9 := a[10][0], a[10][3], a[10][4], a[10][5], a[10][6], a[10][7], a[10][8], a[10][9]
		k0 := k[0][:n]
		k3 := k[3][:n]
		k4 := k[4][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		k8 := k[8][:n]
		k9 := k[9][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c3*k3[i]+c4*k4[i]+c5*k5[i]+c6*k6[i]+c7*k7[i]+c8*k8[i]+c9*k9[i])
		}
	case 11:
		c0, c3, c4, c5, c6, c7, c8, c9, c10 := a[11][0], a[11][3], a[11][4], a[11][5], a[11][6], a[11][7], a[11][8], a[11][9], a[11][10]
		k0 := k[0][:n]
		k3 := k[3][:n]
		k4 := k[4][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		k8 := k[8][:n]
		k9 := k[9][:n]
		k10 := k[10][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c3*k3[i]+c4*k4[i]+c5*k5[i]+c6*k6[i]+c7*k7[i]+c8*k8[i]+c9*k9[i]+c10*k10[i])
		}
	case 12:
		c0, c5, c6, c7, c8, c9, c10, c11 := a[12][0], a[12][5], a[12][6], a[12][7], a[12][8], a[12][9], a[12][10], a[12][11]
		k0 := k[0][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		k8 := k[8][:n]
		k9 := k[9][:n]
		k10 := k[10][:n]
		k11 := k[11][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c5*k5[i]+c6*k6[i]+c7*k7[i]+c8*k8[i]+c9*k9[i]+c10*k10[i]+c11*k11[i])
		}
	case 13:
		c0, c6, c7, c8, c9, c10, c11, c12 := a[13][0], a[13][6], a[13][7], a[13][8], a[13][9], a[13][10], a[13][11], a[13][12]
		k0 := k[0][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		k8 := k[8][:n]
		k9 := k[9][:n]
		k10 := k[10][:n]
		k11 := k[11][:n]
		k12 := k[12][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c6*k6[i]+c7*k7[i]+c8*k8[i]+c9*k9[i]+c10*k10[i]+c11*k11[i]+c12*k12[i])
		}
	case 14:
		c0, c5, c6, c7, c10, c11, c12, c13 := a[14][0], a[14][5], a[14][6], a[14][7], a[14][10], a[14][11], a[14][12], a[14][13]
		k0 := k[0][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		k10 := k[10][:n]
		k11 := k[11][:n]
		k12 := k[12][:n]
		k13 := k[13][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c5*k5[i]+c6*k6[i]+c7*k7[i]+c10*k10[i]+c11*k11[i]+c12*k12[i]+c13*k13[i])
		}
	case 15:
		c0, c5, c6, c7, c8, c12, c13, c14 := a[15][0], a[15][5], a[15][6], a[15][7], a[15][8], a[15][12], a[15][13], a[15][14]
		k0 := k[0][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		k8 := k[8][:n]
		k12 := k[12][:n]
		k13 := k[13][:n]
		k14 := k[14][:n]
		for i := range ys {
			ys[i] = y[i] + h*(c0*k0[i]+c5*k5[i]+c6*k6[i]+c7*k7[i]+c8*k8[i]+c12*k12[i]+c13*k13[i]+c14*k14[i])
		}
	default:
		panic("integrate: stage out of range")
	}
}

// solution writes into yn the 8th-order solution y + h sum_j b_j k_j and
// returns the sums of squares of the scaled 5th- and 3rd-order error
// estimates (dop853.f ERR and ERR2 before the square root), unrolled over
// the stages that carry a weight (bNonZero: b and e5 vanish on stages 1..4).
// The sums run in the order of bNonZero, as the plain loop does.
func solution(yn, y []float64, h float64, k *[16][]float64, atol, rtol []float64) (err5, err3 float64) {
	n := len(yn)
	y, atol, rtol = y[:n], atol[:n], rtol[:n]
	b := &a[12]
	b0, b5, b6, b7, b8, b9, b10, b11 := b[0], b[5], b[6], b[7], b[8], b[9], b[10], b[11]
	e0, e5s5, e6, e7, e8, e9, e10, e11 := e5[0], e5[5], e5[6], e5[7], e5[8], e5[9], e5[10], e5[11]
	k0, k5, k6, k7, k8, k9, k10, k11 := k[0][:n], k[5][:n], k[6][:n], k[7][:n], k[8][:n], k[9][:n], k[10][:n], k[11][:n]
	for i := range yn {
		inc := b0*k0[i] + b5*k5[i] + b6*k6[i] + b7*k7[i] + b8*k8[i] + b9*k9[i] + b10*k10[i] + b11*k11[i]
		e5s := e0*k0[i] + e5s5*k5[i] + e6*k6[i] + e7*k7[i] + e8*k8[i] + e9*k9[i] + e10*k10[i] + e11*k11[i]
		yn[i] = y[i] + h*inc
		e3s := inc - bhh1*k0[i] - bhh2*k8[i] - bhh3*k11[i]
		sk := atol[i] + rtol[i]*max(math.Abs(y[i]), math.Abs(yn[i]))
		err5 += (e5s / sk) * (e5s / sk)
		err3 += (e3s / sk) * (e3s / sk)
	}
	return err5, err3
}
