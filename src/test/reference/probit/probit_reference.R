# Reference probit fit for org.slopewatch.probability.ProbitFitterReferenceTest.
#
# Run from the repository root (Debian r-base-core and r-cran-sandwich):
#   Rscript src/test/reference/probit/probit_reference.R src/test/resources/reference \
#       > src/test/resources/reference/probit-10y1y-h12.csv
#
# Model: y_m ~ probit(alpha + beta * s_m), s_m = 10Y - 1Y monthly average in percentage points,
# horizon h = 12 months. The target and sample are built exactly as ProbitSample.build does in
# the Java code (keep the two in step):
#   * a month r is in recession when peak < r <= trough (the months after a peak through its
#     trough, inclusive);
#   * y_m = 1 when month m + h is in recession;
#   * month m is in the sample only when m + h <= the last month of the yield data (here
#     1999-09), so the last h data months are dropped: n = 558 - 12 = 546.
# Standard errors:
#   * model-based: vcov(glm) = inverse of the expected (Fisher) information X'WX, which is what
#     the Java code reports as CovarianceKind.MODEL_BASED;
#   * Newey-West: sandwich::NeweyWest(fit, lag = 12, prewhite = FALSE, adjust = FALSE), i.e.
#     Bartlett weights 1 - l/(L+1), l = 0..L, no small-sample factor, no prewhitening,
#     V = A^-1 S A^-1 with A = X'WX and S the weighted sum of autocovariances of the scores.
# 90% bands for P at a spread: standard error of the link (index) alpha + beta*s, from
# predict(se.fit = TRUE) for the model-based covariance and x' V x for Newey-West, mapped
# through pnorm: [pnorm(eta - z*se), pnorm(eta + z*se)], z = qnorm(0.95).

suppressPackageStartupMessages(library(sandwich))

args <- commandArgs(trailingOnly = TRUE)
dir <- if (length(args) >= 1) args[1] else "src/test/resources/reference"
horizon <- 12L
lag <- horizon

yields <- read.csv(file.path(dir, "us-cmt-monthly-1953-1999.csv"), check.names = FALSE,
                   colClasses = c("character", rep("numeric", 4)))
cycles <- read.csv(file.path(dir, "us-business-cycle-dates.csv"), colClasses = "character")

# months as integers: year * 12 + (month - 1)
month_index <- function(ym) {
  as.integer(substr(ym, 1, 4)) * 12L + as.integer(substr(ym, 6, 7)) - 1L
}
m <- month_index(yields$date)
stopifnot(all(diff(m) == 1L))  # consecutive months, no gaps
s <- yields[["10Y"]] - yields[["1Y"]]

peaks <- month_index(cycles$peak)
troughs <- month_index(cycles$trough)
in_recession <- function(r) {
  vapply(r, function(x) any(peaks < x & x <= troughs), logical(1))
}

keep <- (m + horizon) <= max(m)
y <- as.integer(in_recession(m + horizon))[keep]
x <- s[keep]

fit <- glm(y ~ x, family = binomial(link = "probit"),
           control = glm.control(epsilon = 1e-14, maxit = 100))
stopifnot(fit$converged)

model_se <- sqrt(diag(vcov(fit)))
nw <- NeweyWest(fit, lag = lag, prewhite = FALSE, adjust = FALSE)
nw_se <- sqrt(diag(nw))
ll <- as.numeric(logLik(fit))
null_fit <- glm(y ~ 1, family = binomial(link = "probit"),
                control = glm.control(epsilon = 1e-14, maxit = 100))
ll0 <- as.numeric(logLik(null_fit))
n <- length(y)

idx_to_ym <- function(i) sprintf("%04d-%02d", i %/% 12L, i %% 12L + 1L)

cat("# Reference output of src/test/reference/probit/probit_reference.R\n")
cat("# command: Rscript src/test/reference/probit/probit_reference.R src/test/resources/reference",
    "> src/test/resources/reference/probit-10y1y-h12.csv\n")
cat("# ", R.version.string, "; sandwich ", as.character(packageVersion("sandwich")),
    "; stats (glm) ", as.character(packageVersion("stats")), "\n", sep = "")
cat("# run on ", format(Sys.Date()), "\n", sep = "")
cat("# glm(y ~ x, family = binomial(link = \"probit\"), control = glm.control(epsilon = 1e-14, maxit = 100))\n")
cat("# NeweyWest(fit, lag = ", lag, ", prewhite = FALSE, adjust = FALSE)\n", sep = "")
cat("# sample: ", idx_to_ym(min(m[keep])), " to ", idx_to_ym(max(m[keep])),
    ", horizon ", horizon, " months\n", sep = "")
cat("quantity,value\n")
out <- function(name, value) cat(name, ",", sprintf("%.15g", value), "\n", sep = "")
out("n", n)
out("recession_ahead_months", sum(y))
out("alpha", coef(fit)[[1]])
out("beta", coef(fit)[[2]])
out("se_alpha_model", model_se[[1]])
out("se_beta_model", model_se[[2]])
out("se_alpha_newey_west", nw_se[[1]])
out("se_beta_newey_west", nw_se[[2]])
out("log_likelihood", ll)
out("null_log_likelihood", ll0)
out("iterations", fit$iter)
z <- qnorm(0.95)
for (at in c(-1, 0, 1)) {
  tag <- sub("-", "m", format(at))
  pr <- predict(fit, newdata = data.frame(x = at), type = "link", se.fit = TRUE)
  v <- c(1, at)
  nw_link_se <- sqrt(drop(t(v) %*% nw %*% v))
  out(paste0("p_at_", tag), pnorm(pr$fit))
  out(paste0("band90_model_lower_at_", tag), pnorm(pr$fit - z * pr$se.fit))
  out(paste0("band90_model_upper_at_", tag), pnorm(pr$fit + z * pr$se.fit))
  out(paste0("band90_newey_west_lower_at_", tag), pnorm(pr$fit - z * nw_link_se))
  out(paste0("band90_newey_west_upper_at_", tag), pnorm(pr$fit + z * nw_link_se))
}
