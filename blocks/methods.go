package blocks

// Method is one entry of the report's Methods appendix: what was done and
// where the method is published.
type Method struct {
	Key       string
	Name      string
	Text      string
	Reference string
}

// Methods lists every method a block may use, in the order the appendix
// shows them.
var Methods = []Method{
	{"exact-decimal", "Exact decimal input", "Numbers are read from their decimal text exactly and shifted by a whole-number constant before they become binary floating point, so that sums, means and deviations keep every digit the data carry.", "McCullough, B. D. (1998). Assessing the reliability of statistical software: Part I. The American Statistician 52(4), 358–366."},
	{"mean-sd", "Mean and standard deviation", "The arithmetic mean and the sample standard deviation (divisor n − 1), computed in two passes over the shifted values; SE = SD/√n.", "Chan, T. F., Golub, G. H. and LeVeque, R. J. (1983). Algorithms for computing the sample variance. The American Statistician 37(3), 242–247."},
	{"t-interval", "Confidence interval of the mean", "Mean ± t(0.975, n − 1) · SE, from Student's t distribution.", "Student (1908). The probable error of a mean. Biometrika 6(1), 1–25."},
	{"quartiles-type7", "Quartiles", "Quantiles by Hyndman and Fan's definition 7: linear interpolation between order statistics at (n − 1)p + 1, the same as a spreadsheet's QUARTILE.INC. IQR = Q3 − Q1.", "Hyndman, R. J. and Fan, Y. (1996). Sample quantiles in statistical packages. The American Statistician 50(4), 361–365."},
	{"skewness-g1", "Skewness", "The adjusted Fisher–Pearson coefficient G1 = √(n(n − 1))/(n − 2) · m3/m2^(3/2), the same as a spreadsheet's SKEW.", "Joanes, D. N. and Gill, C. A. (1998). Comparing measures of sample skewness and kurtosis. The Statistician 47(1), 183–189."},
	{"tukey-box", "Box plots", "Boxes span the quartiles with a line at the median; whiskers reach the most extreme values within 1.5 IQR of the box; points beyond are drawn one by one.", "Tukey, J. W. (1977). Exploratory Data Analysis. Addison-Wesley."},
	{"sturges", "Histogram bins (Sturges)", "⌈log2 n⌉ + 1 bins of equal width over the range of the data. Each bin includes its lower edge and excludes its upper edge; the last includes both.", "Sturges, H. A. (1926). The choice of a class interval. Journal of the American Statistical Association 21(153), 65–66."},
	{"scott", "Histogram bins (Scott)", "Bin width 3.49 · SD · n^(−1/3). Each bin includes its lower edge and excludes its upper edge; the last includes both.", "Scott, D. W. (1979). On optimal and data-based histograms. Biometrika 66(3), 605–610."},
	{"fd", "Histogram bins (Freedman–Diaconis)", "Bin width 2 · IQR · n^(−1/3). Each bin includes its lower edge and excludes its upper edge; the last includes both.", "Freedman, D. and Diaconis, P. (1981). On the histogram as a density estimator: L2 theory. Zeitschrift für Wahrscheinlichkeitstheorie und verwandte Gebiete 57(4), 453–476."},
	{"bins-count", "Histogram bins (fixed count)", "The number of bins the block asks for, of equal width over the range of the data. Each bin includes its lower edge and excludes its upper edge; the last includes both.", ""},
	{"bins-edges", "Histogram bins (given edges)", "The edges the block lists. Each bin includes its lower edge and excludes its upper edge; the last includes both.", ""},
	{"welch", "Difference of two means (Welch)", "The difference of each group's mean from the reference group's, with Welch's t interval and test, which do not assume equal variances; degrees of freedom by Satterthwaite's approximation.", "Welch, B. L. (1947). The generalization of 'Student's' problem when several different population variances are involved. Biometrika 34(1–2), 28–35."},
	{"cohen-d", "Standardized difference (Cohen's d)", "The difference of two means divided by their pooled standard deviation. Cohen's rough guide calls 0.2 small, 0.5 medium and 0.8 large.", "Cohen, J. (1988). Statistical Power Analysis for the Behavioral Sciences, 2nd ed. Erlbaum."},
	{"anova", "One-way analysis of variance", "Between- and within-group sums of squares, F = MS between / MS within with (k − 1, N − k) degrees of freedom; R² = SS between / SS total.", "Fisher, R. A. (1925). Statistical Methods for Research Workers. Oliver and Boyd."},
	{"wilson", "Interval for a proportion (Wilson)", "The Wilson score interval, which behaves well near 0% and 100% and for small groups.", "Wilson, E. B. (1927). Probable inference, the law of succession, and statistical inference. Journal of the American Statistical Association 22(158), 209–212."},
	{"newcombe", "Difference of two proportions (Newcombe)", "The difference in percentage points with Newcombe's hybrid score interval, built from the two Wilson intervals.", "Newcombe, R. G. (1998). Interval estimation for the difference between independent proportions: comparison of eleven methods. Statistics in Medicine 17(8), 873–890."},
	{"katz", "Risk ratio (Katz)", "The ratio of two proportions with the Katz log interval: exp(ln RR ± z·√(1/x₁ − 1/n₁ + 1/x₂ − 1/n₂)). Undefined when a group has no successes.", "Katz, D., Baptista, J., Azen, S. P. and Pike, M. C. (1978). Obtaining confidence intervals for the risk ratio in cohort studies. Biometrics 34(3), 469–474."},
	{"woolf", "Odds ratio (Woolf)", "The odds ratio with Woolf's logit interval: exp(ln OR ± z·√(Σ 1/cell)). Undefined when a cell is empty.", "Woolf, B. (1955). On estimating the relation between blood group and disease. Annals of Human Genetics 19(4), 251–253."},
	{"z-test", "Two-proportion z-test", "The pooled z statistic for the difference of two proportions, two-sided.", "Agresti, A. (2013). Categorical Data Analysis, 3rd ed. Wiley, section 3.1."},
	{"chi-square", "Chi-square test of independence", "Pearson's chi-square statistic, Σ (observed − expected)² / expected, without continuity correction, with (r − 1)(c − 1) degrees of freedom. Cells expected to hold fewer than 5 cases make the p-value approximate; the table says when.", "Pearson, K. (1900). On the criterion that a given system of deviations from the probable… Philosophical Magazine 50(302), 157–175."},
	{"cramer-v", "Cramér's V", "√(χ² / (n · (min(r, c) − 1))): 0 for no association, 1 for complete association.", "Cramér, H. (1946). Mathematical Methods of Statistics. Princeton University Press."},
	{"pearson", "Pearson correlation", "Pearson's r with a two-sided t-test on n − 2 degrees of freedom. A correlation measures linear association, not cause.", "Pearson, K. (1896). Mathematical contributions to the theory of evolution III. Philosophical Transactions of the Royal Society A 187, 253–318."},
	{"fisher-z", "Interval for a correlation (Fisher z)", "tanh(atanh r ± z / √(n − 3)).", "Fisher, R. A. (1921). On the 'probable error' of a coefficient of correlation deduced from a small sample. Metron 1, 3–32."},
	{"spearman", "Spearman's rho", "Pearson's r of the ranks; tied values share their average rank.", "Spearman, C. (1904). The proof and measurement of association between two things. American Journal of Psychology 15(1), 72–101."},
	{"ols-qr", "Least-squares regression", "Ordinary least squares solved by Householder QR decomposition with column pivoting (never the normal equations), carried out in double-double arithmetic on centred columns scaled by powers of two; standard errors, t-tests and 95% intervals from the residual variance. A category predictor is coded as one indicator per level against its first level.", "Golub, G. H. and Van Loan, C. F. (2013). Matrix Computations, 4th ed. Johns Hopkins University Press, chapter 5."},
	{"cooks", "Influential points (Cook's distance)", "Cook's distance for each row; rows above the usual 4/n cut-off are listed for checking.", "Cook, R. D. (1977). Detection of influential observation in linear regression. Technometrics 19(1), 15–18."},
	{"prediction-interval", "Prediction intervals", "ŷ ± t(0.975, n − p) · σ · √(1 + x₀ᵀ(XᵀX)⁻¹x₀): the range for one new case, wider than the interval for the mean. A prediction outside the observed range of the predictors is an extrapolation.", "Montgomery, D. C., Peck, E. A. and Vining, G. G. (2012). Introduction to Linear Regression Analysis, 5th ed. Wiley, section 3.5."},
	{"did", "Difference in differences", "The change from the first to the last time point in one group minus the change in the reference group. It estimates an effect only if both groups would otherwise have changed alike.", "Angrist, J. D. and Pischke, J.-S. (2009). Mostly Harmless Econometrics. Princeton University Press, chapter 5."},
	{"stemleaf", "Stem-and-leaf display", "Each value is split into a stem (its leading digits) and a leaf (the next digit; later digits are cut off, not rounded). The number of lines is chosen near 10 · log10(n).", "Tukey, J. W. (1977). Exploratory Data Analysis. Addison-Wesley; Dixon, W. J. and Kronmal, R. A. (1965). The choice of origin and scale for graphs. Journal of the ACM 12(2), 259–261."},
}

// MethodByKey returns the method with the key, or false.
func MethodByKey(key string) (Method, bool) {
	for _, m := range Methods {
		if m.Key == key {
			return m, true
		}
	}
	return Method{}, false
}
