package figures_test

import (
	"fmt"

	"candor/figures"
)

// Bars of 40 and 60 on an axis cut at 30 are drawn 10 and 30 units tall:
// the drawn effect is 2, the data's 0.5, a lie factor of 4 (Tufte 1983).
func ExampleDraw() {
	from := 30.0
	fig, err := figures.Draw(figures.Spec{
		ID: "orders", Kind: figures.Bar, XLabel: "store", YLabel: "orders", AxisMin: &from,
		Categories: []string{"Harbour", "North"},
		Series:     []figures.Series{{Name: "Orders", Values: []float64{40, 60}}},
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	g := fig.Geometry
	fmt.Println(fig.Desc)
	fmt.Printf("axis %g to %g, lie factor %.2f\n", g.AxisMin, g.AxisMax, g.LieFactor)
	// Output:
	// Bar chart of orders by store: Harbour 40, North 60.
	// axis 30 to 70, lie factor 4.00
}
