# One place for compiler warnings: every brownfloc target calls brownfloc_set_warnings().
function(brownfloc_set_warnings target)
  target_compile_options(${target} PRIVATE -Wall -Wextra -Wpedantic -Wshadow -Wconversion
                                           -Wno-sign-conversion)
  # -Wno-sign-conversion: size_t/index mixing in loops is pervasive and checked by tests;
  # -Wconversion still catches double -> float/int narrowing, which is what matters here.
  if(BROWNFLOC_WARNINGS_AS_ERRORS)
    target_compile_options(${target} PRIVATE -Werror)
  endif()
  target_compile_features(${target} PUBLIC cxx_std_20)
endfunction()
