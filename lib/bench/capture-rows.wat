;; Plain capture rows, parsed in WebAssembly: numbers (a minus, digits, a decimal mark and digits, an exponent of at
;; most three digits) between delimiters, one row per line. The CSV reader (capture-csv.ts) hands a window of
;; complete lines to parseRows and reads any line this stops at the full way, in JavaScript.
;;
;; Ours, in WebAssembly, because no CSV library came near the benchmark's target (see capture-csv.ts) and V8 runs
;; a JavaScript byte loop at about 2 ns a byte on these machines, where this runs at about 1.3.
;; Built into capture-rows-wasm.ts by `npm run build:wasm` (wabt); a unit test checks that the two agree.
;;
;; Memory (the offsets are also in capture-rows.ts):
;;   0 .. 184       powers of ten 1e0 .. 1e22 (f64), written by the caller
;;   256 .. 4096    the role of each column, one byte each: 0 time in seconds, 1 current, 2 voltage, 3 temperature
;;   4096 ..        the window of input lines, then the current, voltage and temperature of the rows read (f64)
(module
  (memory (export "memory") 1)
  (global $columnCount (mut i32) (i32.const 0))
  (global $delimiter (mut i32) (i32.const 44))
  (global $commaIsDecimal (mut i32) (i32.const 0))
  (global $hasTime (mut i32) (i32.const 0))
  (global $scaleCurrent (mut f64) (f64.const 1))
  (global $scaleVoltage (mut f64) (f64.const 1))
  (global $scaleTemperature (mut f64) (f64.const 1))
  ;; Where each channel's values go; 0 for a channel that is not mapped.
  (global $outCurrent (mut i32) (i32.const 0))
  (global $outVoltage (mut i32) (i32.const 0))
  (global $outTemperature (mut i32) (i32.const 0))
  ;; What the last call read: rows, the time of its first row (when that was the reader's first) and last row, and
  ;; its largest time step (after the first such step) with the row it ended on, or -1.
  (global $rows (export "rows") (mut i32) (i32.const 0))
  (global $firstTime (export "firstTime") (mut f64) (f64.const 0))
  (global $lastTime (export "lastTime") (mut f64) (f64.const 0))
  (global $largestInterval (export "largestInterval") (mut f64) (f64.const 0))
  (global $largestIntervalRow (export "largestIntervalRow") (mut i32) (i32.const -1))

  (func (export "configure")
    (param $columnCount i32) (param $delimiter i32) (param $commaIsDecimal i32) (param $hasTime i32)
    (param $scaleCurrent f64) (param $scaleVoltage f64) (param $scaleTemperature f64)
    (param $outCurrent i32) (param $outVoltage i32) (param $outTemperature i32)
    (global.set $columnCount (local.get $columnCount))
    (global.set $delimiter (local.get $delimiter))
    (global.set $commaIsDecimal (local.get $commaIsDecimal))
    (global.set $hasTime (local.get $hasTime))
    (global.set $scaleCurrent (local.get $scaleCurrent))
    (global.set $scaleVoltage (local.get $scaleVoltage))
    (global.set $scaleTemperature (local.get $scaleTemperature))
    (global.set $outCurrent (local.get $outCurrent))
    (global.set $outVoltage (local.get $outVoltage))
    (global.set $outTemperature (local.get $outTemperature)))

  ;; Reads rows from $p, a line start, until $end (a line start), $maxRows rows, or a line it does not take: one that
  ;; is not plain, or whose time does not increase. Returns where it stopped, always a line start. $first says the
  ;; row at $p is the reader's first, which has no time step before it; $lastTime is the time of the row before.
  (func (export "parseRows") (param $p i32) (param $end i32) (param $maxRows i32) (param $first i32) (param $lastTime f64) (result i32)
    (local $lineStart i32) (local $field i32) (local $c i32) (local $d i32) (local $negative i32)
    (local $numberStart i32) (local $mantissa i64) (local $digits i32) (local $exponent i32) (local $fractionStart i32)
    (local $exponentNegative i32) (local $exponentStart i32) (local $written i32)
    (local $value f64) (local $role i32) (local $time f64) (local $current f64) (local $voltage f64) (local $temperature f64)
    (local $rows i32) (local $interval f64) (local $largest f64) (local $largestRow i32) (local $offset i32)
    (local.set $largestRow (i32.const -1))
    (block $done
      (block $reject
        (loop $row
          (br_if $done (i32.ge_u (local.get $p) (local.get $end)))
          (br_if $done (i32.ge_u (local.get $rows) (local.get $maxRows)))
          (local.set $lineStart (local.get $p))
          (local.set $field (i32.const 0))
          (loop $field
            (local.set $c (i32.load8_u (local.get $p)))
            (local.set $negative (i32.eq (local.get $c) (i32.const 45)))
            (if (local.get $negative)
              (then
                (local.set $p (i32.add (local.get $p) (i32.const 1)))
                (local.set $c (i32.load8_u (local.get $p)))))
            (local.set $numberStart (local.get $p))
            (local.set $mantissa (i64.const 0))
            (local.set $d (i32.sub (local.get $c) (i32.const 48)))
            (block $integerEnd
              (loop $integer
                (br_if $integerEnd (i32.gt_u (local.get $d) (i32.const 9)))
                (local.set $mantissa (i64.add (i64.mul (local.get $mantissa) (i64.const 10)) (i64.extend_i32_u (local.get $d))))
                (local.set $p (i32.add (local.get $p) (i32.const 1)))
                (local.set $d (i32.sub (i32.load8_u (local.get $p)) (i32.const 48)))
                (br $integer)))
            (local.set $digits (i32.sub (local.get $p) (local.get $numberStart)))
            (local.set $exponent (i32.const 0))
            (local.set $c (i32.add (local.get $d) (i32.const 48)))
            ;; A decimal point, or a comma when the delimiter leaves the comma as the decimal mark.
            (if (i32.or (i32.eq (local.get $c) (i32.const 46))
                        (i32.and (i32.eq (local.get $c) (i32.const 44)) (global.get $commaIsDecimal)))
              (then
                (local.set $p (i32.add (local.get $p) (i32.const 1)))
                (local.set $fractionStart (local.get $p))
                (local.set $d (i32.sub (i32.load8_u (local.get $p)) (i32.const 48)))
                (block $fractionEnd
                  (loop $fraction
                    (br_if $fractionEnd (i32.gt_u (local.get $d) (i32.const 9)))
                    (local.set $mantissa (i64.add (i64.mul (local.get $mantissa) (i64.const 10)) (i64.extend_i32_u (local.get $d))))
                    (local.set $p (i32.add (local.get $p) (i32.const 1)))
                    (local.set $d (i32.sub (i32.load8_u (local.get $p)) (i32.const 48)))
                    (br $fraction)))
                (local.set $exponent (i32.sub (local.get $fractionStart) (local.get $p)))
                (local.set $digits (i32.add (local.get $digits) (i32.sub (local.get $p) (local.get $fractionStart))))
                (local.set $c (i32.add (local.get $d) (i32.const 48)))))
            ;; e or E
            (if (i32.eq (i32.or (local.get $c) (i32.const 32)) (i32.const 101))
              (then
                (local.set $p (i32.add (local.get $p) (i32.const 1)))
                (local.set $c (i32.load8_u (local.get $p)))
                (local.set $exponentNegative (i32.eq (local.get $c) (i32.const 45)))
                (if (i32.or (local.get $exponentNegative) (i32.eq (local.get $c) (i32.const 43)))
                  (then
                    (local.set $p (i32.add (local.get $p) (i32.const 1)))
                    (local.set $c (i32.load8_u (local.get $p)))))
                (local.set $exponentStart (local.get $p))
                (local.set $written (i32.const 0))
                (block $exponentEnd
                  (loop $exponentDigits
                    (br_if $exponentEnd (i32.gt_u (i32.sub (local.get $c) (i32.const 48)) (i32.const 9)))
                    (br_if $exponentEnd (i32.ge_u (i32.sub (local.get $p) (local.get $exponentStart)) (i32.const 3)))
                    (local.set $written (i32.add (i32.mul (local.get $written) (i32.const 10)) (i32.sub (local.get $c) (i32.const 48))))
                    (local.set $p (i32.add (local.get $p) (i32.const 1)))
                    (local.set $c (i32.load8_u (local.get $p)))
                    (br $exponentDigits)))
                (if (i32.eq (local.get $p) (local.get $exponentStart)) (then (local.set $digits (i32.const 0))))
                (local.set $exponent (i32.add (local.get $exponent)
                  (select (i32.sub (i32.const 0) (local.get $written)) (local.get $written) (local.get $exponentNegative))))))
            ;; Exact when the digits fit 2^53 and |exponent| ≤ 22: one correctly rounded multiply or divide, the value
            ;; JavaScript's own parser gives. Anything else is left to the full loop.
            (br_if $reject (i32.or (i32.eqz (local.get $digits)) (i32.gt_u (local.get $digits) (i32.const 15))))
            (br_if $reject (i32.gt_u (i32.add (local.get $exponent) (i32.const 22)) (i32.const 44)))
            (local.set $value (f64.convert_i64_u (local.get $mantissa)))
            (if (i32.gt_s (local.get $exponent) (i32.const 0))
              (then (local.set $value (f64.mul (local.get $value) (f64.load (i32.shl (local.get $exponent) (i32.const 3))))))
              (else
                (if (i32.lt_s (local.get $exponent) (i32.const 0))
                  (then (local.set $value (f64.div (local.get $value) (f64.load (i32.shl (i32.sub (i32.const 0) (local.get $exponent)) (i32.const 3)))))))))
            (if (local.get $negative) (then (local.set $value (f64.neg (local.get $value)))))
            (local.set $role (i32.load8_u offset=256 (local.get $field)))
            (if (i32.eq (local.get $role) (i32.const 1))
              (then (local.set $current (local.get $value)))
              (else
                (if (i32.eq (local.get $role) (i32.const 2))
                  (then (local.set $voltage (local.get $value)))
                  (else
                    (if (i32.eqz (local.get $role))
                      (then (local.set $time (local.get $value)))
                      (else (local.set $temperature (local.get $value))))))))
            (local.set $field (i32.add (local.get $field) (i32.const 1)))
            (if (i32.lt_u (local.get $field) (global.get $columnCount))
              (then
                (br_if $reject (i32.ne (local.get $c) (global.get $delimiter)))
                (local.set $p (i32.add (local.get $p) (i32.const 1)))
                (br $field)))
            ;; The row ends with LF or CR LF.
            (if (i32.eq (local.get $c) (i32.const 10))
              (then (local.set $p (i32.add (local.get $p) (i32.const 1))))
              (else
                (br_if $reject (i32.or (i32.ne (local.get $c) (i32.const 13)) (i32.ne (i32.load8_u offset=1 (local.get $p)) (i32.const 10))))
                (local.set $p (i32.add (local.get $p) (i32.const 2))))))
          (if (global.get $hasTime)
            (then
              (if (i32.and (local.get $first) (i32.eqz (local.get $rows)))
                (then (global.set $firstTime (local.get $time)))
                (else
                  (local.set $interval (f64.sub (local.get $time) (local.get $lastTime)))
                  ;; Not increasing (or NaN): the full loop rejects the line with its message.
                  (br_if $reject (i32.eqz (f64.gt (local.get $interval) (f64.const 0))))
                  (if (f64.gt (local.get $interval) (local.get $largest))
                    (then
                      (local.set $largest (local.get $interval))
                      (local.set $largestRow (local.get $rows))))))
              (local.set $lastTime (local.get $time))))
          (local.set $offset (i32.shl (local.get $rows) (i32.const 3)))
          (if (global.get $outCurrent)
            (then (f64.store (i32.add (global.get $outCurrent) (local.get $offset)) (f64.mul (local.get $current) (global.get $scaleCurrent)))))
          (if (global.get $outVoltage)
            (then (f64.store (i32.add (global.get $outVoltage) (local.get $offset)) (f64.mul (local.get $voltage) (global.get $scaleVoltage)))))
          (if (global.get $outTemperature)
            (then (f64.store (i32.add (global.get $outTemperature) (local.get $offset)) (f64.mul (local.get $temperature) (global.get $scaleTemperature)))))
          (local.set $rows (i32.add (local.get $rows) (i32.const 1)))
          (br $row)))
      ;; A line not taken is left whole, for the full loop.
      (local.set $p (local.get $lineStart)))
    (global.set $rows (local.get $rows))
    (global.set $lastTime (local.get $lastTime))
    (global.set $largestInterval (local.get $largest))
    (global.set $largestIntervalRow (local.get $largestRow))
    (local.get $p))
)
