# Reference conditional-logit estimates for tests/engine/estimation/mnl-reference.test.ts.
# Data: MASS::housing (Madsen 1976, shipped with R's recommended package MASS). Each of the
# 1681 households makes one choice task among the three satisfaction
# levels (Low, Medium, High). Columns: alternative-specific constants for Medium and High and
# their interactions with Infl, Type and Cont (treatment coding; Low is the reference level),
# i.e. the multinomial logit Sat ~ Infl + Type + Cont written in conditional-logit form.
# Fitted with survival::clogit (conditional likelihood, robust SE clustered by
# respondent) and cross-checked with nnet::multinom. Run: Rscript scripts/reference/mnl-housing-clogit.R
suppressPackageStartupMessages({ library(MASS); library(survival); library(nnet) })
out_dir <- "tests/fixtures/estimation"
h <- MASS::housing
idx <- rep(seq_len(nrow(h)), h$Freq)
people <- h[idx, c("Sat", "Infl", "Type", "Cont")]
# Households are grouped four at a time into one "respondent" with four tasks, so that the
# respondent-clustered robust variance is exercised on clusters larger than one task.
people$household <- seq_len(nrow(people))
people$respondent <- (people$household - 1L) %/% 4L + 1L
people$task <- (people$household - 1L) %% 4L + 1L
alts <- c("Low", "Medium", "High")
long <- do.call(rbind, lapply(alts, function(a) {
  data.frame(respondent = people$respondent, task = people$task, household = people$household, alt = a,
             chosen = as.integer(people$Sat == a),
             Infl = people$Infl, Type = people$Type, Cont = people$Cont)
}))
long <- long[order(long$household, match(long$alt, alts)), ]
cols <- list()
for (a in c("Medium", "High")) {
  asc <- as.integer(long$alt == a)
  cols[[paste0("asc_", a)]] <- asc
  cols[[paste0(a, "_infl_medium")]] <- asc * (long$Infl == "Medium")
  cols[[paste0(a, "_infl_high")]] <- asc * (long$Infl == "High")
  cols[[paste0(a, "_type_apartment")]] <- asc * (long$Type == "Apartment")
  cols[[paste0(a, "_type_atrium")]] <- asc * (long$Type == "Atrium")
  cols[[paste0(a, "_type_terrace")]] <- asc * (long$Type == "Terrace")
  cols[[paste0(a, "_cont_high")]] <- asc * (long$Cont == "High")
}
X <- as.data.frame(cols)
names_x <- names(X)
dat <- cbind(long[, c("respondent", "task", "alt", "chosen")], X)
write.csv(dat[, c("respondent", "task", "alt", "chosen", names_x)], file.path(out_dir, "housing-long.csv"), row.names = FALSE, quote = FALSE)

f <- as.formula(paste("chosen ~", paste(names_x, collapse = " + "), "+ strata(household)"))
dat$household <- long$household
# One chosen alternative per stratum: the Breslow, Efron and exact conditional likelihoods coincide.
fit <- clogit(f, data = dat, method = "breslow", cluster = respondent)
s <- summary(fit)$coefficients
mn <- multinom(Sat ~ Infl + Type + Cont, weights = Freq, data = h, trace = FALSE, reltol = 1e-14, maxit = 1000)

json_num <- function(x) paste0("[", paste(sprintf("%.15g", x), collapse = ", "), "]")
json <- paste0(
  "{\n",
  '  "source": "survival::clogit (method=breslow = exact with one choice per task, cluster=respondent) on MASS::housing expanded to long format",\n',
  '  "rVersion": "', R.version.string, '",\n',
  '  "survivalVersion": "', as.character(packageVersion("survival")), '",\n',
  '  "massVersion": "', as.character(packageVersion("MASS")), '",\n',
  '  "nnetVersion": "', as.character(packageVersion("nnet")), '",\n',
  '  "names": [', paste0('"', names_x, '"', collapse = ", "), "],\n",
  '  "estimates": ', json_num(coef(fit)), ",\n",
  '  "se": ', json_num(s[, "se(coef)"]), ",\n",
  '  "robustSe": ', json_num(s[, "robust se"]), ",\n",
  '  "loglik": ', sprintf("%.15g", fit$loglik[2]), ",\n",
  '  "loglikNull": ', sprintf("%.15g", fit$loglik[1]), ",\n",
  '  "multinomLoglik": ', sprintf("%.15g", -mn$value), ",\n",
  '  "respondents": ', max(people$respondent), "\n",
  "}\n")
writeLines(json, file.path(out_dir, "housing-clogit-reference.json"))
cat(json)
