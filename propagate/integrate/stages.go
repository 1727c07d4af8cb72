package integrate

// stage writes into ys the argument y + h sum_j a[st][j] k_j of stage st
// (1 <= st <= 15), with the sum unrolled over the non-zero coefficients of
// a (written out from their pattern in coefficients.go) so that each
// component accumulates in a register. TestStages checks it against the
// plain sum over all coefficients.
func stage(st int, ys, y []float64, h float64, k *[16][]float64) {
	n := len(ys)
	y = y[:n]
	switch st {
	case 1:
		r := &a[1]
		k0 := k[0][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i])
		}
	case 2:
		r := &a[2]
		k0 := k[0][:n]
		k1 := k[1][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i]+r[1]*k1[i])
		}
	case 3:
		r := &a[3]
		k0 := k[0][:n]
		k2 := k[2][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i]+r[2]*k2[i])
		}
	case 4:
		r := &a[4]
		k0 := k[0][:n]
		k2 := k[2][:n]
		k3 := k[3][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i]+r[2]*k2[i]+r[3]*k3[i])
		}
	case 5:
		r := &a[5]
		k0 := k[0][:n]
		k3 := k[3][:n]
		k4 := k[4][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i]+r[3]*k3[i]+r[4]*k4[i])
		}
	case 6:
		r := &a[6]
		k0 := k[0][:n]
		k3 := k[3][:n]
		k4 := k[4][:n]
		k5 := k[5][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i]+r[3]*k3[i]+r[4]*k4[i]+r[5]*k5[i])
		}
	case 7:
		r := &a[7]
		k0 := k[0][:n]
		k3 := k[3][:n]
		k4 := k[4][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i]+r[3]*k3[i]+r[4]*k4[i]+r[5]*k5[i]+r[6]*k6[i])
		}
	case 8:
		r := &a[8]
		k0 := k[0][:n]
		k3 := k[3][:n]
		k4 := k[4][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i]+r[3]*k3[i]+r[4]*k4[i]+r[5]*k5[i]+r[6]*k6[i]+r[7]*k7[i])
		}
	case 9:
		r := &a[9]
		k0 := k[0][:n]
		k3 := k[3][:n]
		k4 := k[4][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		k8 := k[8][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i]+r[3]*k3[i]+r[4]*k4[i]+r[5]*k5[i]+r[6]*k6[i]+r[7]*k7[i]+r[8]*k8[i])
		}
	case 10:
		r := &a[10]
		k0 := k[0][:n]
		k3 := k[3][:n]
		k4 := k[4][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		k8 := k[8][:n]
		k9 := k[9][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i]+r[3]*k3[i]+r[4]*k4[i]+r[5]*k5[i]+r[6]*k6[i]+r[7]*k7[i]+r[8]*k8[i]+r[9]*k9[i])
		}
	case 11:
		r := &a[11]
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
			ys[i] = y[i] + h*(r[0]*k0[i]+r[3]*k3[i]+r[4]*k4[i]+r[5]*k5[i]+r[6]*k6[i]+r[7]*k7[i]+r[8]*k8[i]+r[9]*k9[i]+r[10]*k10[i])
		}
	case 12:
		r := &a[12]
		k0 := k[0][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		k8 := k[8][:n]
		k9 := k[9][:n]
		k10 := k[10][:n]
		k11 := k[11][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i]+r[5]*k5[i]+r[6]*k6[i]+r[7]*k7[i]+r[8]*k8[i]+r[9]*k9[i]+r[10]*k10[i]+r[11]*k11[i])
		}
	case 13:
		r := &a[13]
		k0 := k[0][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		k8 := k[8][:n]
		k9 := k[9][:n]
		k10 := k[10][:n]
		k11 := k[11][:n]
		k12 := k[12][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i]+r[6]*k6[i]+r[7]*k7[i]+r[8]*k8[i]+r[9]*k9[i]+r[10]*k10[i]+r[11]*k11[i]+r[12]*k12[i])
		}
	case 14:
		r := &a[14]
		k0 := k[0][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		k10 := k[10][:n]
		k11 := k[11][:n]
		k12 := k[12][:n]
		k13 := k[13][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i]+r[5]*k5[i]+r[6]*k6[i]+r[7]*k7[i]+r[10]*k10[i]+r[11]*k11[i]+r[12]*k12[i]+r[13]*k13[i])
		}
	case 15:
		r := &a[15]
		k0 := k[0][:n]
		k5 := k[5][:n]
		k6 := k[6][:n]
		k7 := k[7][:n]
		k8 := k[8][:n]
		k12 := k[12][:n]
		k13 := k[13][:n]
		k14 := k[14][:n]
		for i := range ys {
			ys[i] = y[i] + h*(r[0]*k0[i]+r[5]*k5[i]+r[6]*k6[i]+r[7]*k7[i]+r[8]*k8[i]+r[12]*k12[i]+r[13]*k13[i]+r[14]*k14[i])
		}
	default:
		panic("integrate: stage out of range")
	}
}
