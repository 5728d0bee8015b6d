;; One Adam step (Kingma & Ba 2015, Algorithm 1) over one variable on the wasm backend's heap,
;; four elements per instruction. Each operation is a float32 operation in the order of
;; optimizers.ts's adamUpdate (tfjs's AdamOptimizer order), and WebAssembly's float32
;; arithmetic and square root are correctly rounded, so the results are the same bits:
;;   m′ = β1·m + (1 − β1)·g,  v′ = β2·v + (1 − β2)·g²,
;;   w′ = ((m′/c1) / (√(v′/c2) + ε))·(−lr) + w.
;; Addresses are byte offsets into the imported memory; n is the number of elements.
(module
  (import "tfjs" "memory" (memory 1))

  (func (export "adam") (param $w i32) (param $g i32) (param $m i32) (param $v i32)
                        (param $wOut i32) (param $mOut i32) (param $vOut i32) (param $n i32)
                        (param $b1 f32) (param $b2 f32) (param $a1 f32) (param $a2 f32) (param $eps f32)
                        (param $step f32) (param $c1 f32) (param $c2 f32)
    (local $i i32) (local $end i32)
    (local $vb1 v128) (local $vb2 v128) (local $va1 v128) (local $va2 v128) (local $veps v128)
    (local $vstep v128) (local $vc1 v128) (local $vc2 v128)
    (local $gi v128) (local $mi v128) (local $vi v128)
    (local $sg f32) (local $sm f32) (local $sv f32)
    (local.set $vb1 (f32x4.splat (local.get $b1)))
    (local.set $vb2 (f32x4.splat (local.get $b2)))
    (local.set $va1 (f32x4.splat (local.get $a1)))
    (local.set $va2 (f32x4.splat (local.get $a2)))
    (local.set $veps (f32x4.splat (local.get $eps)))
    (local.set $vstep (f32x4.splat (local.get $step)))
    (local.set $vc1 (f32x4.splat (local.get $c1)))
    (local.set $vc2 (f32x4.splat (local.get $c2)))
    ;; Byte offsets: $i runs over the first n − n mod 4 elements, four at a time.
    (local.set $end (i32.shl (i32.and (local.get $n) (i32.const -4)) (i32.const 2)))
    (block $done (loop $next
      (br_if $done (i32.ge_u (local.get $i) (local.get $end)))
      (local.set $gi (v128.load (i32.add (local.get $g) (local.get $i))))
      (local.set $mi (f32x4.add
        (f32x4.mul (v128.load (i32.add (local.get $m) (local.get $i))) (local.get $vb1))
        (f32x4.mul (local.get $gi) (local.get $va1))))
      (local.set $vi (f32x4.add
        (f32x4.mul (v128.load (i32.add (local.get $v) (local.get $i))) (local.get $vb2))
        (f32x4.mul (f32x4.mul (local.get $gi) (local.get $gi)) (local.get $va2))))
      (v128.store (i32.add (local.get $wOut) (local.get $i))
        (f32x4.add
          (f32x4.mul
            (f32x4.div
              (f32x4.div (local.get $mi) (local.get $vc1))
              (f32x4.add (f32x4.sqrt (f32x4.div (local.get $vi) (local.get $vc2))) (local.get $veps)))
            (local.get $vstep))
          (v128.load (i32.add (local.get $w) (local.get $i)))))
      (v128.store (i32.add (local.get $mOut) (local.get $i)) (local.get $mi))
      (v128.store (i32.add (local.get $vOut) (local.get $i)) (local.get $vi))
      (local.set $i (i32.add (local.get $i) (i32.const 16)))
      (br $next)))
    ;; The last n mod 4 elements, one at a time with the same operations.
    (local.set $end (i32.shl (local.get $n) (i32.const 2)))
    (block $tailDone (loop $tail
      (br_if $tailDone (i32.ge_u (local.get $i) (local.get $end)))
      (local.set $sg (f32.load (i32.add (local.get $g) (local.get $i))))
      (local.set $sm (f32.add
        (f32.mul (f32.load (i32.add (local.get $m) (local.get $i))) (local.get $b1))
        (f32.mul (local.get $sg) (local.get $a1))))
      (local.set $sv (f32.add
        (f32.mul (f32.load (i32.add (local.get $v) (local.get $i))) (local.get $b2))
        (f32.mul (f32.mul (local.get $sg) (local.get $sg)) (local.get $a2))))
      (f32.store (i32.add (local.get $wOut) (local.get $i))
        (f32.add
          (f32.mul
            (f32.div
              (f32.div (local.get $sm) (local.get $c1))
              (f32.add (f32.sqrt (f32.div (local.get $sv) (local.get $c2))) (local.get $eps)))
            (local.get $step))
          (f32.load (i32.add (local.get $w) (local.get $i)))))
      (f32.store (i32.add (local.get $mOut) (local.get $i)) (local.get $sm))
      (f32.store (i32.add (local.get $vOut) (local.get $i)) (local.get $sv))
      (local.set $i (i32.add (local.get $i) (i32.const 4)))
      (br $tail)))))
