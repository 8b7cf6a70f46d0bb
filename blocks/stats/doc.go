// Package stats is candor's numerics: descriptive statistics, frequency
// bins, the tests and intervals that the analysis blocks report, least
// squares, and the exact decimal reading of data that feeds them. It
// imports nothing of the project.
//
// # Data
//
// A sample is a Values: an integer Offset plus the exact decimal
// difference D[i] of each value from it, rounded once to float64
// (ParseDecimal, Decimal.Minus, ParseValues). A NaN in D marks a missing
// value. The routines work on D and add the offset back at the end, so
// data such as 1000000000000.4 keep every digit that their spread needs;
// sums, centring and least squares run in double-double arithmetic
// (about 106 bits; Dekker 1971).
//
// A sample whose values stay elsewhere (a database) gives its sufficient
// statistics instead: Moments from sums about a centre (MomentsFromSums)
// or from parts (CombineMoments), Quartiles from order statistics
// (QuartilesFrom), a Tally of its distinct values and their counts, and a
// BinSample for the binning rules. DescribeMoments, WelchMoments,
// CohenDMoments, OneWayANOVAMoments and BinEdgesFor take these, and
// Describe, Welch, CohenD, OneWayANOVA and BinEdges are those same
// routines on the values' own moments and order statistics.
//
// # Undefined results
//
// No routine panics on degenerate input (no values, one value, equal
// values, empty cells or groups). An undefined result is NaN, and the
// result's Reason (a Reasons map keyed by field name) says why, in words a
// report can show. OLS returns typed errors instead for inputs that admit
// no fit: *DataError, *TooFewRowsError, *ConstantError and
// *CollinearError.
//
// # Methods and accuracy
//
// Each exported routine names the published method it implements in its
// doc comment. The tests check the package against the NIST Statistical
// Reference Datasets (univariate summary statistics, linear regression and
// one-way ANOVA, every set, with the log relative error of McCullough
// 1998), against Anscombe's (1973) quartet, and against values that scipy,
// statsmodels and numpy compute for invented inputs
// (testdata/reference/make_reference.py). The p-values and critical values
// come from gonum's distributions, with the upper tails of F and the
// normal taken from the incomplete beta function and erfc directly, and the
// t quantile polished by Newton's method.
package stats
