package uncertainty

// OpenUnit exports openUnit to the tests of package uncertainty_test.
var OpenUnit = openUnit
